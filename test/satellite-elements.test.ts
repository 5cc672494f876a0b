/**
 * Element-set readers: NORAD two-line elements and CCSDS OMM (JSON, XML). Element values are
 * checked against the fields as published in the verification file of Vallado et al. (2006,
 * AIAA 2006-6753, SGP4-VER.TLE, case 06251); malformed input must name file, line and column.
 */
import { describe, expect, it } from 'vitest';
import { GloamingError } from '../lib/core/errors.ts';
import { readElementFile, readOmmJson, readOmmXml, readTle, tleChecksum } from '../lib/models/satellite/elements.ts';
import { stateAt } from '../lib/models/satellite/propagate.ts';
import { utDays } from '../lib/core/track.ts';
import { expectWithin } from './helpers/tolerance.ts';

// Case 06251 of SGP4-VER.TLE (Vallado et al. 2006), columns 1–69.
const L1 = '1 06251U 62025E   06176.82412014  .00008885  00000-0  12808-3 0  3985';
const L2 = '2 06251  58.0579  54.0425 0030035 139.1568 221.1854 15.56387291  6774';

function errorOf(f: () => unknown): GloamingError {
  try {
    f();
  } catch (error) {
    if (error instanceof GloamingError) return error;
    throw error;
  }
  throw new Error('expected a GloamingError');
}

/** Replaces column `column` (1-based) of `line` with `text`. */
function put(line: string, column: number, text: string): string {
  return line.slice(0, column - 1) + text + line.slice(column - 1 + text.length);
}

describe('two-line element sets', () => {
  it('reads the fields of a published element set, with and without a name line', () => {
    const [plain] = readTle(`${L1}\n${L2}\n`, 'a.tle');
    // Values as printed in SGP4-VER.TLE: epoch 2006 day 176.82412014, i = 58.0579°, e = 0.0030035, n = 15.56387291 rev/day.
    expect(plain!.noradId).toBe(6251);
    expect(plain!.internationalDesignator).toBe('1962-025E');
    expectWithin(plain!.epoch.getTime(), Date.UTC(2006, 0, 1) + 175.82412014 * 86_400_000, 1, 'epoch ms');
    expect(plain!.inclinationDeg).toBe(58.0579);
    expect(plain!.eccentricity).toBe(0.0030035);
    expect(plain!.meanMotionRevPerDay).toBe(15.56387291);
    expectWithin(plain!.bstar, 0.12808e-3, 1e-12, 'B*');
    const [named] = readTle(`0 DELTA 1 DEB\n${L1}\n${L2}`, 'b.tle');
    expect(named!.name).toBe('DELTA 1 DEB');
    expect(named!.source).toEqual({ file: 'b.tle', line: 1 });
  });

  it('computes the published checksum digit (column 69)', () => {
    expect(tleChecksum(L1)).toBe(5);
    expect(tleChecksum(L2)).toBe(4);
  });

  it('names line and column of a wrong checksum, a short line, a bad field, a bad epoch and mismatched numbers', () => {
    const checksum = errorOf(() => readTle(`NAME\n${put(L1, 69, '6')}\n${L2}`, 'x.tle'));
    expect(checksum.message).toMatch(/^x\.tle:2:69: checksum of line 1 does not match \(got '6'\); expected 5/);
    const short = errorOf(() => readTle(`${L1}\n${L2.slice(0, 60)}`, 'x.tle'));
    expect(short.message).toMatch(/^x\.tle:2:61: line 2 of the element set is 60 characters long; expected 69 columns/);
    const badIncl = put(L2, 9, ' 58.O579');
    const field = errorOf(() => readTle(`${L1}\n${put(badIncl, 69, String(tleChecksum(badIncl)))}`, 'x.tle'));
    expect(field.place).toMatchObject({ file: 'x.tle', line: 2, column: 9 });
    expect(field.message).toContain('inclination (columns 9–16) cannot be read');
    const badDay = put(L1, 19, '06400.82412014');
    const epoch = errorOf(() => readTle(`${put(badDay, 69, String(tleChecksum(badDay)))}\n${L2}`, 'x.tle'));
    expect(epoch.code).toBe('invalid-date');
    expect(epoch.place).toMatchObject({ line: 1, column: 21 });
    const other = put(L2, 3, '06252');
    const mismatch = errorOf(() => readTle(`${L1}\n${put(other, 69, String(tleChecksum(other)))}`, 'x.tle'));
    expect(mismatch.message).toMatch(/^x\.tle:2:3: catalogue numbers of line 1 and line 2 differ/);
    const orphan = errorOf(() => readTle(`${L1}\nNOT LINE 2`, 'x.tle'));
    expect(orphan.place).toMatchObject({ line: 2, column: 1 });
  });
});

// The same element set as an OMM, with its keywords as defined in CCSDS 502.0-B-3.
const OMM = {
  OBJECT_NAME: 'DELTA 1 DEB',
  OBJECT_ID: '1962-025E',
  EPOCH: '2006-06-25T19:46:43.980096',
  MEAN_MOTION: 15.56387291,
  ECCENTRICITY: 0.0030035,
  INCLINATION: 58.0579,
  RA_OF_ASC_NODE: 54.0425,
  ARG_OF_PERICENTER: 139.1568,
  MEAN_ANOMALY: 221.1854,
  EPHEMERIS_TYPE: 0,
  CLASSIFICATION_TYPE: 'U',
  NORAD_CAT_ID: 6251,
  ELEMENT_SET_NO: 398,
  REV_AT_EPOCH: 677,
  BSTAR: 0.00012808,
  MEAN_MOTION_DOT: 0.00008885,
  MEAN_MOTION_DDOT: 0,
};

const XML = `<?xml version="1.0" encoding="UTF-8"?>
<ndm>
  <omm id="CCSDS_OMM_VERS" version="3.0">
    <header><CREATION_DATE>2006-06-26T00:00:00</CREATION_DATE><ORIGINATOR>TEST</ORIGINATOR></header>
    <body><segment>
      <metadata>
        <OBJECT_NAME>DELTA 1 DEB</OBJECT_NAME>
        <OBJECT_ID>1962-025E</OBJECT_ID>
        <CENTER_NAME>EARTH</CENTER_NAME>
        <REF_FRAME>TEME</REF_FRAME>
        <TIME_SYSTEM>UTC</TIME_SYSTEM>
        <MEAN_ELEMENT_THEORY>SGP4</MEAN_ELEMENT_THEORY>
      </metadata>
      <data>
        <meanElements>
          <EPOCH>2006-06-25T19:46:43.980096</EPOCH>
          <MEAN_MOTION>15.56387291</MEAN_MOTION>
          <ECCENTRICITY>.0030035</ECCENTRICITY>
          <INCLINATION>58.0579</INCLINATION>
          <RA_OF_ASC_NODE>54.0425</RA_OF_ASC_NODE>
          <ARG_OF_PERICENTER>139.1568</ARG_OF_PERICENTER>
          <MEAN_ANOMALY>221.1854</MEAN_ANOMALY>
        </meanElements>
        <tleParameters>
          <EPHEMERIS_TYPE>0</EPHEMERIS_TYPE>
          <CLASSIFICATION_TYPE>U</CLASSIFICATION_TYPE>
          <NORAD_CAT_ID>6251</NORAD_CAT_ID>
          <ELEMENT_SET_NO>398</ELEMENT_SET_NO>
          <REV_AT_EPOCH>677</REV_AT_EPOCH>
          <BSTAR>.12808E-3</BSTAR>
          <MEAN_MOTION_DOT>.00008885</MEAN_MOTION_DOT>
          <MEAN_MOTION_DDOT>0</MEAN_MOTION_DDOT>
        </tleParameters>
      </data>
    </segment></body>
  </omm>
</ndm>
`;

describe('CCSDS OMM', () => {
  it('reads JSON and XML to the same orbit as the two-line form (within the TLE epoch rounding)', () => {
    const [tle] = readTle(`${L1}\n${L2}`, 'a.tle');
    const [json] = readOmmJson(JSON.stringify([OMM], null, 2), 'a.json');
    const [xml] = readOmmXml(XML, 'a.xml');
    for (const set of [json!, xml!]) {
      expect(set.noradId).toBe(6251);
      expect(set.name).toBe('DELTA 1 DEB');
      expectWithin(set.epoch.getTime(), tle!.epoch.getTime(), 1, 'epoch ms');
      // One day after epoch the three readings must give the same SGP4 position (the TLE's epoch is
      // rounded to 10⁻⁸ day ≈ 1 ms, i.e. ≤ 8 m along the track).
      const ut = utDays(tle!.epoch) + 1;
      const a = stateAt(tle!, ut)!.positionKm;
      const b = stateAt(set, ut)!.positionKm;
      expectWithin(Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]), 0, 0.01, 'position km');
    }
  });

  it('names the line and column of a bad OMM keyword in JSON and XML', () => {
    const text = JSON.stringify([OMM, { ...OMM, ECCENTRICITY: 1.5 }], null, 2);
    const json = errorOf(() => readOmmJson(text, 's.json'));
    const line = text.split('\n').findIndex((l, i) => i > 20 && l.includes('"ECCENTRICITY"')) + 1;
    expect(json.place).toMatchObject({ file: 's.json', line, field: 'ECCENTRICITY' });
    expect(json.message).toContain('ECCENTRICITY is out of range');
    const missing = errorOf(() => readOmmJson(JSON.stringify({ ...OMM, EPOCH: undefined }), 'm.json'));
    expect(missing.code).toBe('missing-field');
    expect(missing.message).toContain('EPOCH');
    const xml = errorOf(() => readOmmXml(XML.replace('<EPOCH>2006-06-25T19:46:43.980096', '<EPOCH>2006-06-31T19:46:43'), 's.xml'));
    expect(xml.code).toBe('invalid-date');
    expect(xml.place).toMatchObject({ file: 's.xml', line: 16, column: 11, field: 'EPOCH' });
    const theory = errorOf(() => readOmmXml(XML.replace('>SGP4<', '>DSST<'), 's.xml'));
    expect(theory.message).toContain('these are not SGP4 mean elements');
    expect(() => readElementFile('', 'elements.csv')).toThrow(/unknown element-set file type/);
  });
});
