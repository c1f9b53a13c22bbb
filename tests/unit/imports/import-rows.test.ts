import { describe, expect, it } from 'vitest';
import { guessMapping, mappingMemory, normaliseHeader } from '../../../shared/imports/guess-mapping';
import { parseImportDate } from '../../../shared/imports/parse-import-date';
import { parseSpecText } from '../../../shared/imports/parse-spec-text';
import { validateImportRow } from '../../../shared/imports/validate-import-row';
import { siteInput } from '../../../shared/schemas/records';
import { SAMPLE_IMPORT_HEADERS } from '../../../server/db/factories/import-csv';
import { decodeImportBytes, parseImportText } from '../../../server/modules/imports/read-import-file';
import { addressKey, nameKey } from '../../../server/modules/imports/match-keys';

describe('guessing the mapping from headers', () => {
  it('maps an office spreadsheet\'s own column names, whatever their case and punctuation', () => {
    const mapping = guessMapping(SAMPLE_IMPORT_HEADERS);
    expect(mapping).toMatchObject({
      customerExternalId: 'Account No',
      customerName: 'Customer',
      customerPhone: 'Phone',
      customerEmail: 'Email',
      siteStreet: 'Service Address',
      siteTown: 'City',
      sitePostalCode: 'Zip',
      applianceKind: 'Equipment',
      fuel: 'Fuel Type',
      manufacturer: 'Make',
      serial: 'Serial #',
      installedOn: 'Install Date',
      part1Type: 'Part 1',
      part1Spec: 'Part 1 Size',
      visit1Date: 'Last Service',
      visit2Date: 'Visit 2 Date',
    });
    expect(normaliseHeader('  SERIAL_No. ')).toBe('serial no');
  });

  it.each(['Elevation', 'Altitude (ft)', 'ELEVATION_FT', 'Site elevation', 'Feet above sea level'])('maps a "%s" column to the site elevation', (header) => {
    expect(guessMapping(['Customer', 'Address', header]).siteElevationFt).toBe(header);
  });

  it('uses one column for one field, and a remembered hand mapping wins over a guess', () => {
    const headers = ['Name', 'Owner', 'Addr', 'Town'];
    expect(guessMapping(headers).customerName).toBe('Name');
    const remembered = mappingMemory({ customerName: 'Owner', siteStreet: 'Addr' });
    const mapping = guessMapping(headers, remembered);
    expect(mapping.customerName).toBe('Owner');
    expect(mapping.siteStreet).toBe('Addr');
    expect(Object.values(mapping).filter((h) => h === 'Name')).toHaveLength(0);
  });
});

describe('dates in the three formats offices use', () => {
  it.each([
    ['2004-03-31', '2004-03-31'],
    ['03/31/2004', '2004-03-31'],
    ['3/1/2004', '2004-03-01'],
    ['Mar 31, 2004', '2004-03-31'],
    ['31 March 2004', '2004-03-31'],
    ['Sept 3, 2019', '2019-09-03'],
  ])('%s → %s', (text, iso) => expect(parseImportDate(text)).toBe(iso));

  it.each(['13/31/2004', '2004-02-30', '02/29/2023', 'yesterday', '2004', '31/12/2004', ''])('refuses %j', (text) => expect(parseImportDate(text)).toBeNull());

  it('knows leap years', () => expect(parseImportDate('02/29/2024')).toBe('2024-02-29'));
});

describe('reading a part\'s size from a cell', () => {
  it('fills the spec fields of the part type', () => {
    expect(parseSpecText('thermocouple', '24 in')).toEqual({ lengthIn: 24 });
    expect(parseSpecText('gauge_glass', '12 in, dia. 5/8 in')).toEqual({ lengthIn: 12, diameterIn: 0.625 });
    expect(parseSpecText('gauge_glass', '12 in, 5/8 in')).toEqual({ lengthIn: 12, diameterIn: 0.625 });
    expect(parseSpecText('nozzle', '0.85 gph, 80°, hollow')).toEqual({ firingRateGph: 0.85, sprayAngleDeg: 80, pattern: 'hollow' });
  });

  it('gives up (null) on text it cannot read, so the importer keeps it as the description', () => {
    expect(parseSpecText('thermocouple', 'the long one')).toBeNull();
    expect(parseSpecText('oil_filter', '10 micron')).toBeNull();
  });
});

describe('one row', () => {
  const columns = { customerName: 'Customer', siteStreet: 'Address', siteTown: 'City', applianceKind: 'Kind', fuel: 'Fuel', installedOn: 'Installed', part1Type: 'Part 1', visit1Date: 'Visit 1', ignitionType: 'Ignition', ventType: 'Vent', construction: 'Build' } as const;
  const partType = (t: string) => (nameKey(t) === 'thermocouple' ? ('thermocouple' as const) : null);
  const row = (cells: Record<string, string>) => validateImportRow({ row: 214, cells, columns, today: '2026-11-18', partType });
  const good = { customerName: 'Pat Example', siteStreet: '12 Elm Street', siteTown: 'Wrenfield', applianceKind: 'Steam', fuel: 'Oil' };

  it('reads our words and the usual ones for kind and fuel, and says what it assumed', () => {
    const { value, errors } = row({ ...good, part1Type: 'Thermocouple', visit1Date: '10/03/2025' });
    expect(errors).toEqual([]);
    expect(value?.appliance).toMatchObject({ kind: 'steam_boiler', fuel: 'oil_no2', ignitionType: 'oil_burner', ventType: 'barometric_damper', construction: 'cast_iron' });
    expect(value?.appliance.assumed).toEqual(['construction', 'ignition', 'vent']);
    expect(value?.visits).toEqual([{ visitedOn: '2025-10-03', type: 'annual_maintenance', outcome: null, notes: '' }]);
  });

  it('names the row, the column and what to do, for every error at once', () => {
    const { value, errors } = row({ ...good, customerName: '', applianceKind: 'heat pump', installedOn: '13/31/2004', part1Type: 'flux capacitor' });
    expect(value).toBeNull();
    expect(errors.map((e) => `row ${e.row}, ${e.column}: ${e.message}`)).toEqual([
      'row 214, Customer: is empty; every row needs it.',
      "row 214, Kind: 'heat pump' is not one we know; use one of: Steam boiler, Hot-water boiler, Water heater, Furnace.",
      "row 214, Installed: '13/31/2004' is not a date; use YYYY-MM-DD, MM/DD/YYYY or a month name such as Jan 6, 2004.",
      "row 214, Part 1: 'flux capacitor' is not one of your part types (see Parts & checklists).",
    ]);
  });

  it('takes ignition and venting from the file when it has them, and then assumes nothing of them', () => {
    const { value } = row({ ...good, ignitionType: 'HSI', ventType: 'power vented', construction: 'steel' } as Record<string, string>);
    expect(value?.appliance).toMatchObject({ ignitionType: 'hot_surface', ventType: 'power_vent', construction: 'steel_fire_tube', assumed: [] });
  });

  it.each([
    ['5280', 5280],
    ['5,280 ft', 5280],
    ['-20 feet', -20],
    ['15000', 15_000],
    ['-1500', -1500],
    ['', null],
  ])('reads the site elevation %j as %s ft', (cell, feet) => {
    const { value, errors } = row({ ...good, siteElevationFt: cell });
    expect(errors).toEqual([]);
    expect(value?.site.elevationFt).toBe(feet);
  });

  it.each(['15001', '-1501', '5280.5', 'mile high'])('refuses the site elevation %j with the site form\'s range', (cell) => {
    // Same whole-foot range as the site form (shared/schemas/records.ts siteInput.elevationFt): −1,500 to 15,000 ft
    const { value, errors } = validateImportRow({ row: 9, cells: { ...good, siteElevationFt: cell }, columns: { siteElevationFt: 'Altitude (ft)' }, today: '2026-11-18', partType });
    expect(value).toBeNull();
    expect(errors).toEqual([
      { row: 9, field: 'siteElevationFt', column: 'Altitude (ft)', value: cell, message: `'${cell}' is not a site elevation in feet (a whole number from −1,500 to 15,000, as on the site form).` },
    ]);
    expect(siteInput.shape.elevationFt.safeParse(Number(cell)).success).toBe(false);
  });

  it('refuses a date after the company\'s today', () => {
    expect(row({ ...good, installedOn: '2026-11-19' }).errors[0].message).toBe("'2026-11-19' is in the future.");
  });

  it('keeps a formula-looking cell as plain text', () => {
    expect(row({ ...good, customerName: '=cmd|\' /C calc\'!A0' }).value?.customer.name).toBe("=cmd|' /C calc'!A0");
  });
});

describe('reading the file', () => {
  it('decodes UTF-8 with a byte-order mark, and Windows-1252 when the bytes are not UTF-8', () => {
    const bom = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('Customer,City\nRenée Example,Wrenfield\n', 'utf8')]);
    const utf8 = decodeImportBytes(bom);
    expect(utf8.encoding).toBe('utf-8');
    expect(parseImportText(utf8.text, utf8.encoding).headers).toEqual(['Customer', 'City']);
    const cp1252 = Buffer.from('Customer,City\nRen\xe9e Example,Wrenfield\n', 'latin1');
    const decoded = decodeImportBytes(cp1252);
    expect(decoded.encoding).toBe('windows-1252');
    expect(parseImportText(decoded.text, decoded.encoding).rows[0][0]).toBe('Renée Example');
  });

  it('keeps quoted commas, quotes and line breaks inside one field', () => {
    const parsed = parseImportText('Customer,Notes\n"Example, Pat","Side door; ""ring twice""\nthen wait"\n', 'utf-8');
    expect(parsed.rows).toEqual([['Example, Pat', 'Side door; "ring twice"\nthen wait']]);
  });

  it.each([
    ['', 'The file is empty.'],
    ['\0\x01\x02PK binary', 'This is not a text file'],
    ['Pat Example,12 Elm St,03/04/2005\n', 'The first row reads like data'],
    ['Customer,,City\nA,B,C\n', 'Column 2 of the first row has no name'],
    ['Customer,customer\nA,B\n', "Two columns are both called 'customer'"],
    ['Customer,City\n', 'no data rows'],
  ])('refuses %j with a clear message', (text, message) => {
    expect(() => parseImportText(decodeImportBytes(Buffer.from(text, 'latin1')).text, 'utf-8')).toThrow(message);
  });

  it('matches addresses and names as an office would', () => {
    expect(addressKey('12 Elm Street')).toBe(addressKey('12 elm st.'));
    expect(nameKey("  O'Neil,  Pat ")).toBe(nameKey('o neil pat'));
  });
});

describe('the sample file in public/', () => {
  it('maps itself and has no row errors against the standard part types', async () => {
    const fs = await import('node:fs');
    const { COMPONENT_TYPES } = await import('../../../shared/trade/component-types');
    const { text, encoding } = decodeImportBytes(fs.readFileSync('public/import-sample.csv'));
    const { headers, rows } = parseImportText(text, encoding);
    const mapping = guessMapping(headers);
    const labels = new Map(Object.entries(COMPONENT_TYPES).map(([code, def]) => [nameKey(def.label), code as keyof typeof COMPONENT_TYPES]));
    const column = new Map(headers.map((h, i) => [h, i]));
    const results = rows.map((cells, i) =>
      validateImportRow({
        row: i + 2,
        cells: Object.fromEntries(Object.entries(mapping).map(([f, h]) => [f, cells[column.get(h!)!]])),
        columns: mapping,
        today: '2026-11-01',
        partType: (t) => labels.get(nameKey(t)) ?? null,
      }),
    );
    expect(results.flatMap((r) => r.errors)).toEqual([]);
    expect(results.every((r) => r.value && r.value.visits.length === 2 && r.value.parts.length >= 1)).toBe(true);
  });
});
