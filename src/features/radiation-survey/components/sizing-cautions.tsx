import { Notice } from '@/components/ui/notice';

/** The cautions beside every sizing figure: the survey informs a proposal, a licensed installer designs the job. */
export function SizingCautions() {
  return (
    <Notice kind="caution" title="A replacement is designed and installed by a licensed installer">
      These figures come from the connected radiation only. The replacement boiler, its piping, venting, gas or oil supply and controls are designed and
      installed by a licensed installer to the manufacturer&apos;s instructions and local codes. Before removing the old boiler: shut off and lock out
      the fuel and power, let it cool fully, and relieve the pressure; steam and hot water scald.
    </Notice>
  );
}
