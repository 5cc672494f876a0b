/**
 * Site validation (issue #2 §2): a bad value is a `GloamingError` naming the field, the value and
 * the allowed range. The ranges are the physical ones (latitude ±90°, longitude ±180°, Bortle
 * classes 1–9 after Bortle 2001, Sky & Telescope) or the documented limits of `lib/core/site.ts`.
 */
import { describe, expect, it } from 'vitest';
import { GloamingError } from '../lib/core/errors.ts';
import { defineSite } from '../lib/core/site.ts';

const GOOD = { latitude: 50.9, longitude: -1.4, timeZone: 'Europe/London' };

/** The error `defineSite` raises for `input`. */
function errorOf(input: unknown): GloamingError {
  try {
    defineSite(input);
  } catch (error) {
    expect(error).toBeInstanceOf(GloamingError);
    return error as GloamingError;
  }
  throw new Error(`defineSite accepted ${JSON.stringify(input)}`);
}

describe('defineSite rejects bad values, naming the field, the value and the allowed range', () => {
  const cases: { what: string; input: Record<string, unknown>; field: string; value: string; range: RegExp }[] = [
    { what: 'latitude 95', input: { ...GOOD, latitude: 95 }, field: 'latitude', value: '95', range: /-90 to 90/ },
    { what: 'latitude −90.5', input: { ...GOOD, latitude: -90.5 }, field: 'latitude', value: '-90.5', range: /-90 to 90/ },
    { what: 'latitude as text', input: { ...GOOD, latitude: 'north' }, field: 'latitude', value: "'north'", range: /-90 to 90/ },
    { what: 'latitude NaN', input: { ...GOOD, latitude: Number.NaN }, field: 'latitude', value: 'null|NaN', range: /-90 to 90/ },
    { what: 'longitude 181', input: { ...GOOD, longitude: 181 }, field: 'longitude', value: '181', range: /-180 to 180/ },
    { what: 'longitude −200', input: { ...GOOD, longitude: -200 }, field: 'longitude', value: '-200', range: /-180 to 180/ },
    { what: 'elevation 10 000 m', input: { ...GOOD, elevation: 10_000 }, field: 'elevation', value: '10000', range: /-500 to 9000/ },
    { what: 'Bortle class 10', input: { ...GOOD, sky: { bortle: 10 } }, field: 'sky.bortle', value: '10', range: /1 to 9/ },
    { what: 'Bortle class 4.5', input: { ...GOOD, sky: { bortle: 4.5 } }, field: 'sky.bortle', value: '4.5', range: /1 to 9/ },
    { what: 'SQM 25', input: { ...GOOD, sky: { sqm: 25 } }, field: 'sky.sqm', value: '25', range: /15 to 22.5/ },
    { what: 'NELM 9', input: { ...GOOD, sky: { nelm: 9 } }, field: 'sky.nelm', value: '9', range: /1 to 8.5/ },
    { what: 'minimum altitude 60°', input: { ...GOOD, minAltitude: 60 }, field: 'minAltitude', value: '60', range: /0 to 45/ },
    { what: 'horizon point at azimuth 400°', input: { ...GOOD, horizon: [{ azimuth: 400, altitude: 5 }] }, field: 'horizon.0.azimuth', value: '400', range: /0 to 360/ },
    { what: 'horizon point at altitude 70°', input: { ...GOOD, horizon: [[90, 70]] }, field: 'horizon.0.1', value: '70', range: /-5 to 60/ },
  ];
  for (const c of cases) {
    it(c.what, () => {
      const e = errorOf(c.input);
      expect(e.code).toBe('invalid-value');
      expect(e.place?.field).toBe(c.field);
      expect(e.message).toContain(c.field.split('.')[0]!);
      expect(e.message).toMatch(new RegExp(`got (${c.value})`));
      expect(e.message).toMatch(c.range);
      expect(e.expected).toMatch(c.range);
    });
  }

  it('unknown time zone names the field and the value', () => {
    const e = errorOf({ ...GOOD, timeZone: 'Mars/Olympus_Mons' });
    expect(e.code).toBe('unknown-zone');
    expect(e.place?.field).toBe('timeZone');
    expect(e.message).toContain('Mars/Olympus_Mons');
    expect(e.expected).toMatch(/IANA/);
  });

  it('missing latitude, longitude or time zone is a missing-field error naming the field', () => {
    for (const field of ['latitude', 'longitude', 'timeZone']) {
      const input: Record<string, unknown> = { ...GOOD };
      delete input[field];
      const e = errorOf(input);
      expect(e.code).toBe('missing-field');
      expect(e.place?.field).toBe(field);
      expect(e.message).toContain(field);
    }
  });

  it('an unknown field is named, with the list of fields that exist', () => {
    const e = errorOf({ ...GOOD, lattitude: 50 });
    expect(e.code).toBe('unknown-field');
    expect(e.place?.field).toBe('lattitude');
    expect(e.expected).toContain('latitude');
  });

  it('unreadable viewing hours name the field and show an example', () => {
    const e = errorOf({ ...GOOD, viewingHours: 'after dinner' });
    expect(e.place?.field).toBe('viewingHours');
    expect(e.message).toContain('after dinner');
    expect(e.expected).toMatch(/19:00/);
  });

  it('an error inside a file carries the file as its place', () => {
    try {
      defineSite({ ...GOOD, latitude: 123 }, { file: 'content/sites/roof.yaml', line: 3, column: 11 });
      expect.unreachable();
    } catch (error) {
      const e = error as GloamingError;
      expect(e.place).toMatchObject({ file: 'content/sites/roof.yaml', line: 3, column: 11, field: 'latitude' });
      expect(e.message.startsWith('content/sites/roof.yaml:3:11')).toBe(true);
    }
  });

  it('the limits themselves are accepted (poles, antimeridian, Bortle 1 and 9)', () => {
    expect(defineSite({ latitude: 90, longitude: 180, timeZone: 'UTC', zoneTolerance: 12 }).latitudeDeg).toBe(90);
    expect(defineSite({ latitude: -90, longitude: -180, timeZone: 'UTC', zoneTolerance: 12 }).longitudeDeg).toBe(-180);
    expect(defineSite({ ...GOOD, sky: { bortle: 1 } }).sky).toEqual({ bortle: 1 });
    expect(defineSite({ ...GOOD, sky: 'bortle:9' }).sky).toEqual({ bortle: 9 });
  });
});
