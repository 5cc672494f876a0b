/**
 * Object-file validation: every bad element set yields a GloamingError that names the file, line,
 * column and field (the "positioned error" requirement), and good files load in both
 * element forms. The expected positions are read off the YAML texts below.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { GloamingError } from '../lib/core/errors.ts';
import { loadObjects } from '../lib/models/orbit/body.ts';
import { loadObjectFile, parseObject, parseTtInstant, toConicElements } from '../lib/models/orbit/elements.ts';

const GOOD = `id: example-comet
name: Comet Example
kind: comet
elements:
  perihelionDistance: 0.62
  eccentricity: 0.9991
  inclination: 71.3
  ascendingNode: 214.8
  argumentOfPerihelion: 102.4
  perihelionTime: 2027-03-18T04:30:00Z
magnitude:
  M1: 6.0
  K1: 10.0
coma: 8
source: "test fixture"
`;

const OSCULATING = `id: example-asteroid
name: Asteroid Example
kind: asteroid
elements:
  semiMajorAxis: 2.7675
  eccentricity: 0.0758
  inclination: 10.59
  ascendingNode: 80.3
  argumentOfPerihelion: 73.6
  meanAnomaly: 95.99
  epoch: 2024-10-17T00:00:00Z
magnitude: { H: 3.34, G: 0.12 }
source: "test fixture"
`;

/** Replaces one line (1-based) of `text`; `null` deletes it. */
function withLine(text: string, line: number, replacement: string | null): string {
  const lines = text.split('\n');
  if (replacement === null) lines.splice(line - 1, 1);
  else lines[line - 1] = replacement;
  return lines.join('\n');
}

function errorOf(text: string): GloamingError {
  try {
    parseObject(text, 'objects/bad.yaml');
  } catch (error) {
    expect(error).toBeInstanceOf(GloamingError);
    return error as GloamingError;
  }
  throw new Error('expected a GloamingError, but the file was accepted');
}

describe('object files that are right', () => {
  it('the perihelion form of the issue example loads with its values', () => {
    const o = parseObject(GOOD, 'good.yaml');
    expect(o.kind).toBe('comet');
    expect(o.elements.form).toBe('perihelion');
    expect(o.comaArcmin).toBe(8);
    expect(o.magnitude).toEqual({ model: 'comet', M1: 6, K1: 10 });
    // 2027-03-18T04:30 TT is JD 2461482.6875 (Meeus 2nd ed. ch. 7 calendar → JD); days from J2000.
    expect(toConicElements(o.elements).perihelionTimeTt).toBeCloseTo(2461482.6875 - 2451545, 9);
  });

  it('the osculating form converts with q = a(1 − e) and T = epoch − M/n (Meeus eq. 33.6 for n)', () => {
    const o = parseObject(OSCULATING, 'good.yaml');
    const el = toConicElements(o.elements);
    expect(el.perihelionDistanceAu).toBeCloseTo(2.7675 * (1 - 0.0758), 12);
    // n = 0.9856076686° / a^1.5 per day (Meeus eq. 33.6: n = 0.9856076686 / (a √a)).
    const nDeg = 0.9856076686 / (2.7675 * Math.sqrt(2.7675));
    const epoch = (Date.UTC(2024, 9, 17) - Date.UTC(2000, 0, 1, 12)) / 86_400_000;
    expect(el.perihelionTimeTt).toBeCloseTo(epoch - 95.99 / nDeg, 6);
  });

  it('a Julian Ephemeris Date is accepted for instants (JD 2451545.0 = 2000 Jan 1.5 TT, Meeus ch. 7)', () => {
    expect(parseTtInstant(2451545.0, 'x')).toBe(0);
    expect(parseTtInstant('2000-01-01T12:00:00Z', 'x')).toBe(0);
  });

  it('loadObjects reads every *.yaml of a folder sorted by file name and rejects duplicate ids', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gloaming-objects-'));
    writeFileSync(join(dir, 'b.yaml'), GOOD);
    writeFileSync(join(dir, 'a.yaml'), OSCULATING);
    writeFileSync(join(dir, 'notes.txt'), 'not an object');
    expect(loadObjects(dir).map((b) => b.id)).toEqual(['example-asteroid', 'example-comet']);
    writeFileSync(join(dir, 'c.yaml'), GOOD);
    expect(() => loadObjects(dir)).toThrow(/c\.yaml.*already used/);
    expect(loadObjects(join(dir, 'missing'))).toEqual([]);
  });

  it('names in other languages load beside name', () => {
    const object = parseObject(withLine(GOOD, 2, 'name: Comet Example\nnames: { es: Cometa Ejemplo, de: Komet Beispiel }'), 'objects/names.yaml');
    expect(object.name).toBe('Comet Example');
    expect(object.names).toEqual({ es: 'Cometa Ejemplo', de: 'Komet Beispiel' });
    expect(parseObject(GOOD, 'objects/good.yaml').names).toBeUndefined();
  });

  it('the demo object file loads', () => {
    const lumen = loadObjectFile('content/objects/comet-lumen.yaml');
    expect(lumen.id).toBe('comet-lumen');
    // Its (invented) epoch of osculation, 2026-11-27 0h TT, in days from J2000.0 (2000-01-01 12h TT).
    expect(lumen.elements.epochTt).toBe((Date.UTC(2026, 10, 27) - Date.UTC(2000, 0, 1, 12)) / 86_400_000);
  });
});

describe('bad object files give positioned errors (file:line:column and field)', () => {
  // [what, text, code, field, line, column]; lib/core/yaml.ts places a field at its value (for a missing
  // field: at the parent mapping's first value).
  const cases: Array<[string, string, string, string, number, number]> = [
    ['negative eccentricity', withLine(GOOD, 6, '  eccentricity: -0.2'), 'invalid-value', 'elements.eccentricity', 6, 17],
    ['zero perihelion distance', withLine(GOOD, 5, '  perihelionDistance: 0'), 'invalid-value', 'elements.perihelionDistance', 5, 23],
    ['negative perihelion distance', withLine(GOOD, 5, '  perihelionDistance: -1.5'), 'invalid-value', 'elements.perihelionDistance', 5, 23],
    ['inclination above 180°', withLine(GOOD, 7, '  inclination: 190'), 'invalid-value', 'elements.inclination', 7, 16],
    ['negative inclination', withLine(GOOD, 7, '  inclination: -3'), 'invalid-value', 'elements.inclination', 7, 16],
    ['angle not finite', withLine(GOOD, 8, '  ascendingNode: .nan'), 'invalid-value', 'elements.ascendingNode', 8, 18],
    ['angle not a number', withLine(GOOD, 9, '  argumentOfPerihelion: far'), 'invalid-value', 'elements.argumentOfPerihelion', 9, 25],
    ['unknown element', withLine(GOOD, 5, '  perihelionDistanse: 0.62'), 'unknown-field', 'elements.perihelionDistanse', 5, 23],
    ['unknown top-level field', withLine(GOOD, 14, 'comma: 8'), 'unknown-field', 'comma', 14, 8],
    ['missing perihelion time', withLine(GOOD, 10, null), 'missing-field', 'elements.perihelionTime', 5, 3],
    ['missing eccentricity', withLine(GOOD, 6, null), 'missing-field', 'elements.eccentricity', 5, 3],
    ['missing source', withLine(GOOD, 15, null), 'missing-field', 'source', 1, 1],
    ['invalid date', withLine(GOOD, 10, '  perihelionTime: 2027-02-30T04:30:00Z'), 'invalid-date', 'elements.perihelionTime', 10, 19],
    ['date with a zone offset', withLine(GOOD, 10, '  perihelionTime: 2027-03-18T04:30:00+02:00'), 'invalid-date', 'elements.perihelionTime', 10, 19],
    ['osculating (elliptic) form with e ≥ 1', withLine(OSCULATING, 6, '  eccentricity: 1.02'), 'invalid-value', 'elements.eccentricity', 6, 17],
    ['perihelion form with an epoch that is no date', withLine(GOOD, 10, '  perihelionTime: 2027-03-18T04:30:00Z\n  epoch: 2027-02-30'), 'invalid-date', 'elements.epoch', 11, 10],
    ['perihelion form with an epoch that is a word', withLine(GOOD, 10, '  perihelionTime: 2027-03-18T04:30:00Z\n  epoch: recent'), 'invalid-date', 'elements.epoch', 11, 10],
    ['osculating form without its epoch', withLine(OSCULATING, 11, null), 'missing-field', 'elements.epoch', 5, 3],
    ['osculating form without a', withLine(OSCULATING, 5, null), 'missing-field', 'elements.semiMajorAxis', 5, 3],
    ['forms mixed', withLine(GOOD, 5, '  semiMajorAxis: 2.2'), 'unknown-field', 'elements.semiMajorAxis', 5, 18],
    ['non-positive semi-major axis', withLine(OSCULATING, 5, '  semiMajorAxis: 0'), 'invalid-value', 'elements.semiMajorAxis', 5, 18],
    ['id not a slug', withLine(GOOD, 1, 'id: Example Comet'), 'invalid-value', 'id', 1, 5],
    ['unknown kind', withLine(GOOD, 3, 'kind: planet'), 'invalid-value', 'kind', 3, 7],
    ['H–G magnitude for a comet', withLine(withLine(GOOD, 12, '  H: 6.0'), 13, '  G: 0.15'), 'unknown-field', 'magnitude.H', 12, 6],
    ['unknown magnitude field', withLine(GOOD, 13, '  K2: 5'), 'unknown-field', 'magnitude.K2', 13, 7],
    ['negative magnitude band', withLine(GOOD, 13, '  K1: 10\n  uncertainty: -1'), 'invalid-value', 'magnitude.uncertainty', 14, 16],
    ['zero coma', withLine(GOOD, 14, 'coma: 0'), 'invalid-value', 'coma', 14, 7],
    ['names in an unknown language', withLine(GOOD, 2, 'name: Comet Example\nnames: { es: Cometa Ejemplo, it: Cometa Esempio }'), 'invalid-value', 'names.it', 3, 34],
    ['names with the English name', withLine(GOOD, 2, 'name: Comet Example\nnames:\n  en: Comet Example'), 'invalid-value', 'names.en', 4, 7],
    ['an empty name in names', withLine(GOOD, 2, 'name: Comet Example\nnames:\n  de: ""'), 'invalid-value', 'names.de', 4, 7],
    ['names not a mapping', withLine(GOOD, 2, 'name: Comet Example\nnames: Cometa Ejemplo'), 'invalid-value', 'names', 3, 8],
    ['elements not a mapping', GOOD.split('\n').filter((_, i) => i < 4 || i > 9).join('\n').replace('elements:', 'elements: 5'), 'invalid-value', 'elements', 4, 11],
  ];

  for (const [what, text, code, field, line, column] of cases) {
    it(`${what} → ${code} at objects/bad.yaml:${line}:${column} field '${field}'`, () => {
      const error = errorOf(text);
      expect(error.code).toBe(code);
      expect(error.place?.field).toBe(field);
      expect(error.message).toContain(`objects/bad.yaml:${line}:${column}`);
      expect(error.message).toContain(field);
      if (code === 'invalid-value') expect(error.expected, 'says what would be right').toBeTruthy();
    });
  }

  it('a suggestion is offered for a misspelt element', () => {
    expect(errorOf(withLine(GOOD, 7, '  inclinaton: 71.3')).hint).toBe("did you mean 'inclination'?");
  });

  it('YAML syntax errors are positioned too', () => {
    const error = errorOf(withLine(GOOD, 6, '  eccentricity: [0.9'));
    expect(error.code).toBe('invalid-yaml');
    expect(error.message).toMatch(/objects\/bad\.yaml:\d+:\d+/);
  });
});
