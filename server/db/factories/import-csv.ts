import Papa from 'papaparse';
import { fakerFor } from './faker';
import { INVENTED_MAKES, INVENTED_NEIGHBOUR_TOWNS, pickInvented } from './invented-names';

/** The headers an old office spreadsheet might have: not our field names, so the mapping has to guess. */
export const SAMPLE_IMPORT_HEADERS = [
  'Account No', 'Customer', 'Phone', 'Email', 'Service Address', 'City', 'Zip', 'Equipment', 'Fuel Type', 'Make', 'Model', 'Serial #',
  'Input BTU', 'Install Date', 'Part 1', 'Part 1 Size', 'Part 2', 'Part 2 Size', 'Last Service', 'Visit 1 Outcome', 'Visit 2 Date', 'Visit 2 Notes',
] as const;

const KINDS = [
  { kind: 'Steam boiler', fuel: 'Gas', parts: [['gauge glass', '12 in, dia. 5/8 in'], ['thermocouple', '24 in']] },
  { kind: 'Hot water', fuel: 'Natural gas', parts: [['thermocouple', '30 in'], ['boiler relief valve', '']] },
  { kind: 'Steam', fuel: 'Oil', parts: [['oil burner nozzle', '0.85 gph, 80°, hollow'], ['oil filter', '']] },
  { kind: 'Hot water boiler', fuel: '#2 oil', parts: [['oil burner nozzle', '1.00 gph, 70°, solid'], ['oil filter', '']] },
  { kind: 'Water heater', fuel: 'Propane', parts: [['thermocouple', '18 in'], ['', '']] },
] as const;

/**
 * An invented office spreadsheet of `rows` appliances (one row each, two past visits), in our sample's column names.
 * Dates come in the three formats offices use; a customer with two boilers appears on two rows.
 */
export function sampleImportRows(rows: number, options: { seed?: number; today?: string } = {}): string[][] {
  const f = fakerFor(options.seed ?? 7);
  const thisYear = Number((options.today ?? '2026-11-01').slice(0, 4));
  const out: string[][] = [];
  let customer: string[] = [];
  for (let i = 0; i < rows; i++) {
    // Every seventh appliance is a customer's second one, at the same address.
    if (i % 7 !== 6 || !customer.length) {
      customer = [
        `C-${String(10_000 + i)}`,
        f.person.fullName(),
        `555-${f.string.numeric(4)}`,
        f.internet.email({ provider: 'example.test' }).toLowerCase(),
        `${f.number.int({ min: 2, max: 990 })} ${f.location.street()}`,
        pickInvented(f, INVENTED_NEIGHBOUR_TOWNS),
        f.string.numeric(5),
      ];
    }
    const k = KINDS[i % KINDS.length];
    const installYear = thisYear - f.number.int({ min: 3, max: 30 });
    const month = f.number.int({ min: 1, max: 12 });
    const day = f.number.int({ min: 1, max: 28 });
    const installed = [`${installYear}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`, `${month}/${day}/${installYear}`, `${['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'][month - 1]} ${day}, ${installYear}`][i % 3];
    out.push([
      ...customer,
      k.kind,
      k.fuel,
      pickInvented(f, INVENTED_MAKES),
      `M-${f.string.alphanumeric(4).toUpperCase()}`,
      `SN${f.string.numeric(8)}-${i}`,
      String(f.number.int({ min: 6, max: 30 }) * 10_000),
      installed,
      k.parts[0][0],
      k.parts[0][1],
      k.parts[1][0],
      k.parts[1][1],
      `${thisYear - 1}-10-${String(day).padStart(2, '0')}`,
      i % 40 === 39 ? 'Shut down as unsafe' : 'Left running',
      `10/${day}/${thisYear - 2}`,
      i % 5 === 0 ? 'Cleaned burners, "replaced" gauge glass washers, low-water cutoff tripped, water still visible' : '',
    ]);
  }
  return out;
}

export const toCsv = (headers: readonly string[], rows: string[][]) => Papa.unparse({ fields: [...headers], data: rows }, { newline: '\r\n' });
