import type { Faker } from '@faker-js/faker';

// Faker's company and vehicle generators can produce real names, so companies and makes come from our own lists.
export const INVENTED_COMPANY_NAMES = [
  'Brassgate Heating',
  'Kettle Hollow Boiler Service',
  'Lanternfield Steam & Hydronics',
  'Quillmere Heat Works',
  'Tarrow Valley Heating',
];

export const INVENTED_MAKES = [
  'Harrowgate Foundry',
  'Coldwater Ironworks',
  'Pellory Thermal',
  'Amberline Boilerworks',
  'Stonebridge Heat Co.',
  'Northcott Hydronic',
];

export const INVENTED_TOWN = 'Wrenfield';
export const INVENTED_NEIGHBOUR_TOWNS = ['Wrenfield', 'East Wrenfield', 'Millbrook Crossing', 'Ashby Hollow'];

export function pickInvented<T>(f: Faker, list: readonly T[]): T {
  return list[f.number.int({ min: 0, max: list.length - 1 })];
}
