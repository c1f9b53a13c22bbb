import { CombustionReadings } from './combustion-readings';
import { GasInputReadings } from './gas-input-readings';
import { GaugeGlassReading } from './gauge-glass-reading';
import { LowWaterCutoffReading } from './lwco-reading';
import { MakeupWaterReadings, OilReadings, ScalarReading, isScalarReading } from './simple-readings';
import { ThermocoupleReadings } from './thermocouple-readings';

/** The inputs for one readings key named by a checklist item (keys of readingsInput in shared/schemas/visits.ts). */
export function ReadingBlock({ readingKey }: { readingKey: string }) {
  switch (readingKey) {
    case 'combustion':
      return <CombustionReadings />;
    case 'gasInput':
      return <GasInputReadings />;
    case 'thermocouple':
      return <ThermocoupleReadings />;
    case 'gaugeGlassLevel':
      return <GaugeGlassReading />;
    case 'lowWaterCutoff':
      return <LowWaterCutoffReading />;
    case 'oil':
      return <OilReadings />;
    case 'makeupWater':
      return <MakeupWaterReadings />;
    default:
      return isScalarReading(readingKey) ? <ScalarReading readingKey={readingKey as Parameters<typeof ScalarReading>[0]['readingKey']} /> : null;
  }
}
