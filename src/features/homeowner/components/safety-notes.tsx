import { Notice } from '@/components/ui/notice';

/** The usual words of caution, shown where they matter to someone living with the appliance. */
export function SafetyNotes({ kind, fuel }: { kind: string; fuel: string }) {
  const gas = fuel === 'natural_gas' || fuel === 'propane';
  return (
    <div className="flex flex-col gap-2">
      <Notice kind="caution" title="Carbon monoxide alarms">
        Have a carbon monoxide alarm near the bedrooms and test it every month. If it sounds, get everyone out of the house and call for help from
        outside.
      </Notice>
      {gas && (
        <Notice kind="caution" title="If you smell gas">
          Leave the house at once. Do not touch light switches or phones inside, and do not light anything. Call the gas company or 911 from outside.
        </Notice>
      )}
      {kind === 'steam_boiler' && (
        <Notice kind="caution" title="The water level in a steam boiler">
          If no water shows in the gauge glass, do not add any. Turn the boiler off, let it cool, and call your service company.
        </Notice>
      )}
      <p className="text-sm text-iron-muted">
        Work on gas and oil appliances is for licensed professionals, under local codes. The manufacturer&apos;s instructions always come first.
      </p>
    </div>
  );
}
