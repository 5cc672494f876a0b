/**
 * Problems of a template are worded in the template's language (`weekly.es.md` is Spanish): the
 * same error corpus as bulletin-errors.test.ts, with the language in the file name. The place
 * (`file:line:column`, the field) and the code are those of the English message; the words come
 * from the catalogue's `err.*` messages. Golden messages below were written by hand for each
 * language (Spanish, German and French usage, from memory) and checked against their inputs.
 */
import { describe, expect, it } from 'vitest';
import { BodyRegistry } from '../lib/core/body.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { loadSites } from '../lib/models/content.ts';
import { ProblemList, checkPages, formatProblem, pagesFor, parseBulletin, renderBulletinSync } from '../lib/outputs/bulletin/index.ts';
import { localeFor } from '../lib/outputs/bulletin/pages.ts';
import { CASE_INPUTS, type ErrorInput } from './bulletin-errors.cases.ts';

const sites = loadSites('content/sites');
const FM = '---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n';

function fileIn(language: string, file = 'content/bulletins/bad.md'): string {
  return language === 'en' ? file : file.replace(/\.md$/, `.${language}.md`);
}

/** The error a case raises when its template is in `language`. */
function run(c: Pick<ErrorInput, 'stage' | 'text' | 'file'>, language: string): GloamingError {
  try {
    const t = parseBulletin(c.text, fileIn(language, c.file));
    if (c.stage === 'pages') pagesFor([t], { sites, today: '2026-12-04' });
    if (c.stage === 'render') renderBulletinSync(t, { site: sites.get('harbour-roof')!, week: isoWeekOf('2026-12-04'), bodies: new BodyRegistry() });
  } catch (error) {
    if (error instanceof GloamingError) return error;
    throw error;
  }
  throw new Error('no error');
}

const render = (markdown: string) => ({ stage: 'render' as const, text: FM + markdown + '\n' });
const parse = (text: string) => ({ stage: 'parse' as const, text });

/** Three kinds of problem in each language: an unknown placeholder, a bad attribute value, a front matter error. */
const GOLDEN: Record<'es' | 'de' | 'fr', [ReturnType<typeof render | typeof parse>, string][]> = {
  es: [
    [render('Sun :sunsett.'), "content/bulletins/bad.es.md:6:5: marcador desconocido ':sunsett'; se esperaba un marcador de la lista de lib/outputs/bulletin/PLACEHOLDERS.md — ¿quiso decir 'sunset'?"],
    [render(':dark{kind=nautcal}'), "content/bulletins/bad.es.md:6:1 field 'kind': 'nautcal' no es un valor de 'kind' (se leyó 'nautcal'); se esperaba civil | nautical | astronomical — ¿quiso decir 'nautical'?"],
    [render(':sunset{night=8}'), "content/bulletins/bad.es.md:6:1 field 'night': la noche 8 está fuera de la semana (se leyó '8'); se esperaba mon…sun, 1–7 o una fecha YYYY-MM-DD de la semana — las noches van de 1 (lunes) a 7 (domingo)"],
    [parse('---\ntitle: T\nsites: all\nshedule: { every: week }\n---\nx\n'), "content/bulletins/bad.es.md:4:10 field 'shedule': campo de cabecera desconocido 'shedule'; se esperaba uno de title, description, sites, schedule, date, bodies, eclipse — ¿quiso decir 'schedule'?"],
    [parse('---\ntitle: T\nsites: all\ndate: 2026-02-30\n---\nx\n'), "content/bulletins/bad.es.md:4:7 field 'date': no se puede leer la fecha '2026-02-30'; se esperaba una fecha escrita YYYY-MM-DD, p. ej. 2026-12-04"],
  ],
  de: [
    [render('A :frobnicate here.'), "content/bulletins/bad.de.md:6:3: unbekannter Platzhalter ':frobnicate'; erwartet: ein Platzhalter aus lib/outputs/bulletin/PLACEHOLDERS.md — \\: schreiben, um einen Doppelpunkt vor einem Wort zu behalten"],
    [render(':direction{body=mars at=set style=compass}'), "content/bulletins/bad.de.md:6:1 field 'style': 'compass' ist kein Wert von 'style' (gelesen: 'compass'); erwartet: word | short | degrees"],
    [render(':altitude{body=mars at=transit precision=5}'), "content/bulletins/bad.de.md:6:1 field 'precision': das Attribut 'precision' liegt außerhalb des Bereichs (gelesen: '5'); erwartet: eine ganze Zahl 0–2"],
    [parse('---\nsites: all\nschedule: { every: week }\n---\nx\n'), "content/bulletins/bad.de.md:2:1 field 'title': das Feld 'title' fehlt; erwartet: der Titel des Bulletins als Text"],
    [parse('---\ntitle: T\nsites: all\ndate: 2026-08-12\neclipse: yes\n---\nx\n'), "content/bulletins/bad.de.md:5:10 field 'eclipse': eclipse muss true oder false sein (gelesen: 'yes'); erwartet: true oder false"],
  ],
  fr: [
    [render('Up at :rise{body=jupyter}.'), "content/bulletins/bad.fr.md:6:7 field 'body': astre inconnu 'jupyter'; attendu\u00a0: l’un de sun, moon, mercury, venus, mars, jupiter, saturn, uranus, neptune — vouliez-vous dire 'jupiter'\u202f?"],
    [render('Intro.\n\nOn :event{type=full-mon}.'), "content/bulletins/bad.fr.md:8:4 field 'type': 'full-mon' n’est pas une valeur de 'type' (lu\u00a0: 'full-mon'); attendu\u00a0: new-moon | first-quarter | full-moon | last-quarter | perigee | apogee | equinox | solstice | opposition | conjunction | greatest-elongation | greatest-brilliancy | stationary | close-approach | meteor-shower-peak | lunar-eclipse | solar-eclipse | perihelion | closest-approach-to-earth | peak-brightness | satellite-pass | variable-minimum | occultation — vouliez-vous dire 'full-moon'\u202f?"],
    [render(':sunset{night=funday}'), "content/bulletins/bad.fr.md:6:1 field 'night': impossible de lire la nuit 'funday' (lu\u00a0: 'funday'); attendu\u00a0: mon…sun, 1–7 ou une date YYYY-MM-DD de la semaine"],
    [parse('---\ntitle: T\nsites: 5\nschedule: { every: week }\n---\nx\n'), "content/bulletins/bad.fr.md:3:8 field 'sites': sites doit être une liste d’ids (lu\u00a0: 5); attendu\u00a0: 'all' ou une liste d’ids de sites comme [harbour-roof]"],
    [parse('---\ntitle: T\nsites: all\nschedule: { every: month }\n---\nx\n'), "content/bulletins/bad.fr.md:4:20 field 'schedule.every': seuls les calendriers hebdomadaires sont pris en charge (lu\u00a0: 'month'); attendu\u00a0: 'week'"],
  ],
};

describe('problems of a template in its own language', () => {
  for (const [language, cases] of Object.entries(GOLDEN)) {
    it.each(cases.map(([input, message]) => [message, input] as const))(`${language}: %s`, (message, input) => {
      expect(run(input, language).message).toBe(message);
    });
  }

  it('every case of the English corpus keeps its code and place in es, de and fr, and none keeps the English words', () => {
    for (const c of CASE_INPUTS) {
      const english = run(c, 'en');
      for (const language of ['es', 'de', 'fr']) {
        const other = run(c, language);
        const where = `${language} '${c.name}'`;
        expect(other.code, where).toBe(english.code);
        expect({ ...other.place, file: undefined }, where).toEqual({ ...english.place, file: undefined });
        expect(other.place?.file, where).toBe(fileIn(language, english.place?.file ?? c.file));
        expect(other.reason, where).not.toBe(english.reason);
        expect(other.detail, where).not.toMatch(/\((got|expected) |; expected |did you mean/);
      }
    }
  });

  it('an echoed value is shown exactly as written, whatever the language does to its own words', () => {
    // French contracts "de le" and elides "de" before a vowel; Spanish "de el"; every language tidies "..": none of it may touch the author's text.
    for (const [language, value] of [['fr', 'de le..a'], ['es', 'de el,,'], ['de', 'in dem .']] as const) {
      const error = run(render(`:sunset{night="${value}"}`), language);
      expect(error.detail.split(`'${value}'`).length - 1, `${language}: ${error.detail}`).toBe(2);
    }
  });

  it('gloaming check lists a Spanish template’s problems in Spanish, an English one’s in English, at the same places', () => {
    const text = FM + 'Sale a las :rise{body=jupiter night=frii}.\n';
    const problems = new ProblemList();
    const templates = [parseBulletin(text, 'content/bulletins/weekly.es.md'), parseBulletin(text, 'content/bulletins/weekly.md')];
    const week = isoWeekOf('2026-12-04');
    checkPages(templates.map((template) => ({ template, site: sites.get('harbour-roof')!, week })), { bodies: new BodyRegistry(), problems });
    expect(problems.errors.map(formatProblem)).toEqual([
      "error: content/bulletins/weekly.es.md:6:12 field 'night': no se puede leer la noche 'frii' (se leyó 'frii'); se esperaba mon…sun, 1–7 o una fecha YYYY-MM-DD de la semana — ¿quiso decir 'fri'?",
      "error: content/bulletins/weekly.md:6:12 field 'night': cannot read the night 'frii' (got 'frii'); expected mon…sun, 1–7 or a YYYY-MM-DD date in the week — did you mean 'fri'?",
    ]);
  });

  it('warnings too: a repeated section with nothing to repeat and a value slot with no value, in the template\'s language (the site and week after them are the command line\'s)', () => {
    // Northern outpost in midsummer: no comet in the registry, and Neptune hidden by 24 h daylight.
    const outpost = sites.get('northern-outpost')!;
    const text = FM + 'Comets:\n\n:::every-target{kind=comet}\n- :name\n:::\n\nLook at :best-time{body=neptune}.\n';
    const warnings = (language: 'es' | 'de' | 'fr') => {
      const template = parseBulletin(text, `content/bulletins/t.${language}.md`);
      // The page's locale, as pagesFor gives it: the template's language with the site's region.
      const site = { ...outpost, locale: localeFor(language, outpost.locale) };
      return renderBulletinSync(template, { site, week: isoWeekOf('2026-06-24'), bodies: new BodyRegistry() }).problems.map(formatProblem);
    };
    expect(warnings('es')[0]).toBe(
      "warning: content/bulletins/t.es.md:8:1: ':::every-target{kind=comet}' no tiene nada que repetir el lunes, 22 de junio ni tiene ::otherwise, así que no imprime nada — añada ::otherwise con una frase para esas noches (site northern-outpost, week 2026-W26)",
    );
    expect(warnings('de')[1]).toBe(
      "warning: content/bulletins/t.de.md:12:9: ':best-time{body=neptune}' hat am Montag, 22. Juni keinen Wert (Neptun ist in dieser Nacht nicht sichtbar: vom Tageslicht überstrahlt) und druckt daher '–' — in :::provided{seen=either body=neptune} mit ::otherwise setzen oder :verdict für den vollständigen Satz verwenden (site northern-outpost, week 2026-W26)",
    );
    expect(warnings('fr')[1]).toMatch(/^warning: content\/bulletins\/t\.fr\.md:12:9: ':best-time\{body=neptune\}' n’a pas de valeur le lundi 22 juin \(.+\) et affiche donc '–' — placez-la dans :::provided\{seen=either body=neptune\} avec ::otherwise, ou utilisez :verdict pour la phrase complète \(site northern-outpost, week 2026-W26\)$/);
  });
});
