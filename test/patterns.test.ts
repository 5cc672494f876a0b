/**
 * The star-pattern file: schema validation, coverage of both hemispheres and all seasons, and
 * each figure's stars checked against the IAU constellation boundaries (astronomy-engine's
 * `Constellation`) and against the source's star names.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Constellation } from 'astronomy-engine';
import { checkPatterns, patternById, patterns, PATTERNS_FILE } from '../lib/models/stars/patterns.ts';
import { starByHip } from '../lib/models/stars/catalogue.ts';
import { loadYaml } from '../lib/core/yaml.ts';
import { GloamingError } from '../lib/core/errors.ts';

describe('patterns file: schema', () => {
  it('the bundled file validates with no errors and holds at least 40 patterns', () => {
    const source = loadYaml(readFileSync(PATTERNS_FILE, 'utf8'), 'patterns.yaml');
    const { errors, patterns: list } = checkPatterns(source.data, source);
    expect(errors.map((e) => e.message)).toEqual([]);
    expect(list.length).toBeGreaterThanOrEqual(40);
    expect(new Set(list.map((p) => p.id)).size).toBe(list.length);
  });

  it('every star exists in the table, every line and part uses listed stars', () => {
    for (const p of patterns()) {
      for (const hip of p.stars) expect(starByHip(hip), `${p.id}: HIP ${hip}`).toBeDefined();
      for (const [a, b] of p.lines) {
        expect(p.stars, `${p.id} line`).toContain(a);
        expect(p.stars, `${p.id} line`).toContain(b);
      }
      for (const hips of Object.values(p.parts)) for (const hip of hips) expect(p.stars, `${p.id} part`).toContain(hip);
    }
  });

  const valid = { id: 'demo', name: 'Demo', familiarity: 1, stars: [54061, 53910], lines: [[54061, 53910]] };
  const codesOf = (data: unknown): string[] => checkPatterns(data).errors.map((e) => `${e.code} ${e.place?.field}`);

  it('reports duplicate ids, lines to unlisted stars, unknown stars and unknown fields at their field', () => {
    expect(codesOf({ patterns: [valid] })).toEqual([]);
    expect(codesOf({ patterns: [valid, valid] })).toEqual(['invalid-value patterns.1.id']);
    expect(codesOf({ patterns: [{ ...valid, lines: [[54061, 58001]] }] })).toEqual(['invalid-value patterns.0.lines.0.1']);
    expect(codesOf({ patterns: [{ ...valid, stars: [54061, 53910, 1] }] })).toEqual(['invalid-value patterns.0.stars.2']);
    expect(codesOf({ patterns: [{ ...valid, colour: 'red' }] })).toEqual(['unknown-field patterns.0.colour']);
    expect(codesOf({ patterns: [{ ...valid, parts: { bowl: [58001] } }] })).toEqual(['invalid-value patterns.0.parts.bowl.0']);
    expect(codesOf({ patterns: [{ ...valid, familiarity: 4 }] })).toEqual(['invalid-value patterns.0.familiarity']);
    expect(codesOf({ patterns: [{ ...valid, lines: [[54061, 54061]] }] })).toEqual(['invalid-value patterns.0.lines.0']);
    expect(codesOf({})).toEqual(['missing-field patterns']);
  });

  it('places errors at their line in a YAML file', () => {
    const text = 'patterns:\n  - id: demo\n    name: Demo\n    familiarity: 1\n    stars: [54061, 53910]\n    lines: [[54061, 99999999]]\n';
    const source = loadYaml(text, 'bad.yaml');
    const [error] = checkPatterns(source.data, source).errors;
    expect(error).toBeInstanceOf(GloamingError);
    expect(error!.place).toMatchObject({ file: 'bad.yaml', line: 6 });
  });

  it('unknown pattern ids get a suggestion', () => {
    expect(() => patternById('big-diper')).toThrow(/did you mean 'big-dipper'/);
  });
});

describe('patterns file: coverage', () => {
  const centre = (id: string): { raHours: number; decDeg: number } => {
    const p = patternById(id);
    let x = 0, y = 0, z = 0;
    for (const hip of p.stars) {
      const s = starByHip(hip)!;
      const r = Math.PI / 180;
      x += Math.cos(s.decDeg * r) * Math.cos(s.raDeg * r);
      y += Math.cos(s.decDeg * r) * Math.sin(s.raDeg * r);
      z += Math.sin(s.decDeg * r);
    }
    return { raHours: (((Math.atan2(y, x) * 12) / Math.PI) + 24) % 24, decDeg: (Math.atan2(z, Math.hypot(x, y)) * 180) / Math.PI };
  };

  it('covers both hemispheres and every 4-hour band of right ascension (all seasons)', () => {
    const centres = patterns().map((p) => centre(p.id));
    expect(centres.filter((c) => c.decDeg > 30).length).toBeGreaterThanOrEqual(8);
    expect(centres.filter((c) => c.decDeg < -30).length).toBeGreaterThanOrEqual(8);
    for (let band = 0; band < 24; band += 4) {
      expect(centres.filter((c) => c.raHours >= band && c.raHours < band + 4).length, `RA ${band}–${band + 4} h`).toBeGreaterThanOrEqual(4);
    }
  });

  it('includes the patterns the issue names', () => {
    for (const id of ['big-dipper', 'cassiopeia', 'summer-triangle', 'great-square', 'orion', 'leo', 'teapot', 'southern-cross', 'centaurus', 'pleiades', 'taurus', 'scorpius', 'winter-hexagon', 'spring-triangle', 'northern-cross', 'little-dipper', 'gemini', 'corvus', 'lyra', 'aquila', 'auriga', 'perseus', 'andromeda', 'capricornus', 'carina', 'false-cross', 'triangulum-australe', 'grus', 'piscis-austrinus', 'achernar-hydrus']) {
      expect(() => patternById(id)).not.toThrow();
    }
    expect(Object.keys(patternById('big-dipper').parts)).toEqual(expect.arrayContaining(['bowl', 'handle']));
    expect(Object.keys(patternById('orion').parts)).toEqual(expect.arrayContaining(['belt', 'shoulders']));
  });
});

describe('patterns file: figures against the IAU boundaries (astronomy-engine Constellation)', () => {
  // Which constellations each figure's stars must lie in: the figure's own constellation, or the
  // listed ones for asterisms that span several.
  const EXPECTED: Record<string, string[]> = {
    'big-dipper': ['UMa'], 'little-dipper': ['UMi'], cassiopeia: ['Cas'], 'summer-triangle': ['Lyr', 'Cyg', 'Aql'],
    'great-square': ['Peg', 'And'], orion: ['Ori'], leo: ['Leo'], teapot: ['Sgr'], 'southern-cross': ['Cru'],
    centaurus: ['Cen'], pleiades: ['Tau'], taurus: ['Tau'], scorpius: ['Sco'],
    'winter-hexagon': ['CMa', 'CMi', 'Gem', 'Aur', 'Tau', 'Ori'], 'winter-triangle': ['Ori', 'CMa', 'CMi'],
    'spring-triangle': ['Boo', 'Vir', 'Leo'], 'spring-arc': ['UMa', 'Boo', 'Vir'], 'northern-cross': ['Cyg'], lyra: ['Lyr'],
    aquila: ['Aql'], auriga: ['Aur', 'Tau'], perseus: ['Per'], andromeda: ['And'], capricornus: ['Cap'], carina: ['Car'],
    'false-cross': ['Car', 'Vel'], 'triangulum-australe': ['TrA'], grus: ['Gru'], 'piscis-austrinus': ['PsA'],
    'achernar-hydrus': ['Eri', 'Hyi'], gemini: ['Gem'], corvus: ['Crv'], bootes: ['Boo'], 'corona-borealis': ['CrB'],
    hercules: ['Her'], delphinus: ['Del'], 'canis-major': ['CMa'], 'canis-minor': ['CMi'], virgo: ['Vir'], libra: ['Lib'],
    aries: ['Ari'], cepheus: ['Cep'], 'draco-head': ['Dra'], ophiuchus: ['Oph'], lepus: ['Lep'], hydra: ['Hya'], circlet: ['Psc'],
  };

  it('every pattern has an expected constellation list in this test', () => {
    expect(patterns().map((p) => p.id).filter((id) => !(id in EXPECTED))).toEqual([]);
  });

  for (const [id, cons] of Object.entries(EXPECTED)) {
    it(`${id}: stars lie in ${cons.join(', ')}`, () => {
      for (const hip of patternById(id).stars) {
        const s = starByHip(hip)!;
        expect(cons, `${id}: HIP ${hip} (${s.label})`).toContain(Constellation(s.raDeg / 15, s.decDeg).symbol);
      }
    });
  }

  it('named stars sit where the figures put them (names from the source star-name index)', () => {
    const names = (id: string): string[] => patternById(id).stars.map((h) => starByHip(h)!.name);
    expect(names('big-dipper')).toEqual(['Dubhe', 'Merak', 'Phecda', 'Megrez', 'Alioth', 'Mizar', 'Alkaid']);
    expect(names('summer-triangle')).toEqual(['Vega', 'Deneb', 'Altair']);
    expect(names('great-square')).toEqual(['Alpheratz', 'Scheat', 'Markab', 'Algenib']);
    expect(patternById('orion').parts['belt']!.map((h) => starByHip(h)!.name)).toEqual(['Alnitak', 'Alnilam', 'Mintaka']);
    expect(names('southern-cross').slice(0, 3)).toEqual(['Acrux', 'Mimosa', 'Gacrux']);
    expect(patternById('centaurus').parts['Pointers']!.map((h) => starByHip(h)!.name)).toEqual(['Rigil Kentaurus', 'Hadar']);
    expect(patternById('leo').parts['Sickle']![0]).toBe(starByHip(49669)!.hip);
    expect(starByHip(49669)!.name).toBe('Regulus');
  });
});
