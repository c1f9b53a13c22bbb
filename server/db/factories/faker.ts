import { Faker, en } from '@faker-js/faker';

let shared: Faker | null = null;

/** A faker with a fixed seed for the demo; tests get a shared unseeded one so parallel files never collide. */
export function fakerFor(seed?: number): Faker {
  if (seed !== undefined) {
    const f = new Faker({ locale: [en] });
    f.seed(seed);
    return f;
  }
  shared ??= new Faker({ locale: [en] });
  return shared;
}
