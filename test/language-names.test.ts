/**
 * Every star pattern of lib/stars/patterns.yaml, and every named part of it, has its name in each
 * language's table (lib/language/names/), with a gender and, in German, a dative; every table
 * says where its names come from. The names themselves are common usage in each language's
 * amateur community, from memory (as each table says); IAU star names stay in every language.
 */
import { describe, expect, it } from 'vitest';
import { BUILT_IN_IDS } from '../lib/core/body.ts';
import { NAMES } from '../lib/core/language/names/index.ts';
import { patterns } from '../lib/models/stars/patterns.ts';

describe('names of patterns and bodies per language', () => {
  for (const [language, table] of Object.entries(NAMES)) {
    it(`${language}: every pattern and part has a name, gender${language === 'de' ? ' and dative' : ''}`, () => {
      expect(table.source).toMatch(/\w/);
      for (const p of patterns()) {
        const entry = table.patterns[p.id];
        expect(entry, `${language} ${p.id}`).toBeDefined();
        expect(entry!.name.trim()).not.toBe('');
        if (language === 'de') expect(entry!.dative, `${language} ${p.id} dative`).toMatch(/\S/);
        for (const part of Object.keys(p.parts)) {
          const named = entry!.parts?.[part];
          expect(named, `${language} ${p.id}.${part}`).toBeDefined();
          if (language === 'de') expect(named!.dative, `${language} ${p.id}.${part} dative`).toMatch(/\S/);
        }
      }
      expect(Object.keys(table.patterns).sort()).toEqual(patterns().map((p) => p.id).sort());
    });
    it(`${language}: the Sun, the Moon and the planets have names`, () => {
      for (const id of BUILT_IN_IDS) expect(table.bodies[id], `${language} ${id}`).toBeDefined();
    });
  }
  it('IAU star names stay the same in every language (Polaris, Capella, Arcturus, Spica)', () => {
    expect(NAMES.es.patterns['little-dipper']!.parts!.handle!.phrase).toContain('Polaris');
    expect(NAMES.de.patterns['spring-arc']!.phrase).toContain('Arcturus und Spica');
    expect(NAMES.fr.patterns.auriga!.parts!.Kids!.phrase).toContain('Capella');
  });
});
