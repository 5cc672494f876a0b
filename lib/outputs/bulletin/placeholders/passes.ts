/**
 * Satellite passes (lib/models/satellite): the week's list, the brightest pass, its chart. Nights
 * the element sets do not reach say so in a sentence, never with a stale pass. Words from the catalogues (`pass.*`, lib/models/satellite/words.ts).
 */
import type { ElementContent, Properties } from 'hast';
import { wordsFor } from '../../../core/language/index.ts';
import { formatInstant, localDateOf } from '../../../core/time.ts';
import { brightestPass, recommendedPasses, type PassNight } from '../../../models/satellite/nights.ts';
import type { SatellitePass } from '../../../models/satellite/passes.ts';
import { maxAltitude, passWords } from '../../../models/satellite/words.ts';
import { passEvent } from '../../almanac/satellite-passes.ts';
import { chartPassOf, passAltSentence } from '../../chart/pass.ts';
import type { AttributeSpec } from '../attributes.ts';
import { el, exact, formatClock, formatDay } from '../format.ts';
import { CLOCK, NIGHT, classes, nightDate, noValue, type PlaceholderCall, type PlaceholderSpec } from './call.ts';

/** The nights a pass placeholder is about: the one given with `night=`, or the whole week. */
function passNightsOf(call: PlaceholderCall): PassNight[] {
  const nights = call.week.passNights();
  return call.given.has('night') ? [nights[call.night]!] : nights;
}

/** The pass phrases in the page's language. */
function wordsOf(call: PlaceholderCall): ReturnType<typeof passWords> {
  return passWords(wordsFor(call.site.locale));
}

/** How the nights of a pass placeholder are named in sentences. */
function passSpan(call: PlaceholderCall): string {
  return call.given.has('night') ? formatDay(nightDate(call), call.site, { weekday: 'long' }) : wordsOf(call).thisWeek;
}

/** Why the nights have no pass to show (a phrase): none followed, elements out of reach, or no bright pass. */
function noPassReason(call: PlaceholderCall, nights: readonly PassNight[]): { id: 'no-satellites' | 'unavailable' | 'none'; text: string } {
  const followed = call.week.satellites.length;
  const words = wordsOf(call);
  if (followed === 0) return { id: 'no-satellites', text: words.noSatellites };
  if (nights.every((n) => n.unavailable.length === followed)) return { id: 'unavailable', text: words.unavailable(passSpan(call)) };
  return { id: 'none', text: call.given.has('night') ? words.noneThisNight : words.noneThisWeek };
}

/** The sentence for nights the element sets (all, or some) do not reach when others are predicted; null when every night is. */
function partlyUnavailable(call: PlaceholderCall, nights: readonly PassNight[]): string | null {
  const followed = call.week.satellites.length;
  if (nights.every((n) => n.unavailable.length === 0) || nights.every((n) => n.unavailable.length === followed)) return null;
  // The element sets reach a run of nights, so the gaps are runs at the ends of the week: name each by its first and last night.
  const days = (ns: PassNight[]): string | null => {
    if (ns.length === 0) return null;
    const day = (n: PassNight): string => formatDay(n.date, call.site, { weekday: 'short' });
    return ns.length === 1 ? day(ns[0]!) : wordsOf(call).days(day(ns[0]!), day(ns[ns.length - 1]!));
  };
  return wordsOf(call).partly(days(nights.filter((n) => n.unavailable.length === followed)), days(nights.filter((n) => n.unavailable.length > 0 && n.unavailable.length < followed)));
}

/** A phrase as a sentence: capital first letter, full stop. */
function sentence(phrase: string): string {
  return phrase.charAt(0).toUpperCase() + phrase.slice(1) + (phrase.endsWith('.') ? '' : '.');
}

function passData(pass: SatellitePass): Properties {
  const seen = pass.visible!;
  return { dataSatellite: pass.satellite.id, dataMagnitude: exact(seen.best.magnitude!, 2), dataAltitudeDeg: exact(maxAltitude(pass), 2), dataElementAgeDays: exact(pass.elements.ageDays, 2) };
}

/** `::passes`: the passes to recommend, brightest first up to `limit`, listed in time order. */
function passList(call: PlaceholderCall): ElementContent {
  const nights = passNightsOf(call);
  const all = recommendedPasses(nights);
  const partly = partlyUnavailable(call, nights);
  const note = (text: string): ElementContent => el('p', { className: ['gl-passes-note'] }, text);
  if (all.length === 0) {
    const why = noPassReason(call, nights);
    return el('div', { ...classes(call, 'gl-none'), dataReason: why.id }, [el('p', {}, sentence(why.text)), ...(partly ? [note(partly)] : [])]);
  }
  const limit = call.attrs.get('limit') as number;
  const shown = [...all].sort((a, b) => a.visible!.best.magnitude! - b.visible!.best.magnitude!).slice(0, limit);
  const zone = call.site.timeZone;
  const items = all.filter((p) => shown.includes(p)).map((p) => {
    const event = passEvent(p, call.site);
    return el('li', passData(p), [
      el('time', { dateTime: formatInstant(p.visible!.start.time, zone) }, `${formatDay(localDateOf(p.visible!.start.time, zone), call.site, { weekday: 'short' })} ${formatClock(p.visible!.start.time, call.site, { precision: 'minute' })}`),
      { type: 'text', value: ' ' },
      el('span', { className: ['gl-event-text'] }, event.description),
    ]);
  });
  const more = all.length - shown.length;
  return el('div', { ...classes(call), dataCount: String(all.length) }, [el('ul', {}, items), ...(more > 0 ? [note(wordsOf(call).more(more))] : []), ...(partly ? [note(partly)] : [])]);
}

/** `:brightest-pass`: the brightest pass to recommend of the week (or night): its time, date, sentence, magnitude or satellite. */
function brightestPassOf(call: PlaceholderCall): ElementContent {
  const nights = passNightsOf(call);
  const pass = brightestPass(nights);
  if (!pass) {
    const why = noPassReason(call, nights);
    return noValue(call, why.text, { dataReason: why.id });
  }
  const zone = call.site.timeZone;
  const start = pass.visible!.start.time;
  const data = { ...classes(call), ...passData(pass) };
  switch (call.attrs.get('show')) {
    case 'date':
      return el('time', { ...data, dateTime: localDateOf(start, zone) }, formatDay(localDateOf(start, zone), call.site, { weekday: 'long' }));
    case 'sentence':
      return el('span', data, passEvent(pass, call.site).description);
    case 'magnitude':
      return el('data', { ...data, value: exact(pass.visible!.best.magnitude!, 2) }, wordsOf(call).magnitude(pass.visible!.best.magnitude!));
    case 'satellite':
      return el('span', data, pass.satellite.name);
    default:
      return el('time', { ...data, dateTime: formatInstant(start, zone) }, formatClock(start, call.site, { clock: call.clock, precision: 'minute' }));
  }
}

/** `::pass-chart`: the whole-sky chart of the brightest pass of the week (or night), with its track. */
function passChart(call: PlaceholderCall): ElementContent {
  const nights = passNightsOf(call);
  const pass = brightestPass(nights);
  if (!pass) {
    const why = noPassReason(call, nights);
    return el('p', { ...classes(call, 'gl-none'), dataReason: why.id }, wordsOf(call).noChart(why.text));
  }
  const output = call.charts;
  const drawn = chartPassOf(pass);
  const c = output.cache.get({ kind: 'sky', site: call.site, time: pass.visible!.best.time, options: { pass: drawn } });
  const caption = passAltSentence(drawn, call.site);
  return el('figure', { ...classes(call), dataChart: c.key, ...passData(pass) }, [
    el('img', { src: output.url(c.files.svg), width: c.width, height: c.height, loading: 'lazy', decoding: 'async', alt: c.alt }),
    el('figcaption', {}, caption),
  ]);
}

const PASS_NIGHT: AttributeSpec = { ...NIGHT, default: 'the whole week' };

export const PASS_PLACEHOLDERS: PlaceholderSpec[] = [
  {
    name: 'passes',
    form: 'block',
    summary: 'satellite passes to look for this week (or night): seen with the naked eye for at least a minute, brightest first up to the limit, listed in time order with where each appears and disappears; a sentence when the orbital elements do not reach the week',
    attributes: { night: PASS_NIGHT, limit: { type: { kind: 'integer', min: 1, max: 50 }, default: '8', doc: 'at most this many (the brightest)' } },
    example: '::passes',
    render: passList,
  },
  {
    name: 'brightest-pass',
    form: 'inline',
    slot: true,
    summary: 'the brightest satellite pass to look for this week (or night): when it appears, its date, the sentence, its magnitude or the satellite',
    attributes: { night: PASS_NIGHT, show: { type: { kind: 'choice', values: ['time', 'date', 'sentence', 'magnitude', 'satellite'] }, default: 'time', doc: 'what to show' }, clock: CLOCK },
    example: ':brightest-pass{show=date}',
    render: brightestPassOf,
  },
  {
    name: 'pass-chart',
    form: 'block',
    summary: 'a whole-sky chart of the brightest satellite pass of the week (or night) at its best moment: the track, where it appears and disappears, the way it moves',
    attributes: { night: PASS_NIGHT },
    example: '::pass-chart',
    render: passChart,
  },
];
