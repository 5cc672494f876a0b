/**
 * The placeholder vocabulary: one table, one entry per placeholder. An entry names the
 * placeholder, says whether it is written inline (`:name{…}`) or as a block on its own line
 * (`::name{…}`), lists its attributes with types and defaults, gives an example for the docs, and
 * renders from the shared week data (`WeekData`). Adding a placeholder is adding one entry.

 *
 * Output is semantic HTML: `<time datetime>` for instants and dates, `<data value>` for numbers,
 * `data-*` attributes carrying the exact values, and classes `gl gl-<name>` for styling.
 */
import type { ElementContent, Properties } from 'hast';
import type { Body } from '../../core/body.ts';
import { compass, handMeasure, fists } from '../../core/describe.ts';
import type { EventTime, MissingReason } from '../../core/events.ts';
import { PHASE_LABEL } from '../../core/moon.ts';
import type { Site } from '../../core/site.ts';
import { addDays, formatInstant, localDateOf, zonedTime } from '../../core/time.ts';
import type { AttributeSpec, AttributeValue, ClockTime } from './attributes.ts';
import { FALLBACK_MARK } from './problems.ts';
import { el, exact, formatClock, formatDay, formatDayRange, formatNumber, type Clock, type TimePrecision } from './format.ts';
import type { WeekData } from './week.ts';
import type { ChartOutput } from './types.ts';
import { ChartCache } from '../chart/cache.ts';
import { placeholderChart } from '../chart/index.ts';
import { EVENT_TYPES, pickEvent, type AlmanacEvent, type AlmanacEventType } from '../almanac/index.ts';
import { reasonText, VERDICT_WORDS, WINDOW_END_TEXT, type Visibility } from '../../models/visibility.ts';
import { GloamingError } from '../../core/errors.ts';

/** A target within this angle of the Sun (geocentric, at local midnight of the night) triggers the eye-safety caution. */
export const NEAR_SUN_DEG = 15;

/** What a render function gets: the placeholder's typed attributes and the shared week. */
export interface PlaceholderCall {
  name: string;
  site: Site;
  week: WeekData;
  /** Night 0–6 of the week (0 = Monday evening) the placeholder is about. */
  night: number;
  clock: Clock;
  /** Attribute values, defaults filled in. */
  attrs: ReadonlyMap<string, AttributeValue>;
  /** Names of the attributes the author wrote (as opposed to defaults). */
  given: ReadonlySet<string>;
  /** Records that `body` is a near-Sun target (adds the eye-safety caution to the page). */
  nearSun(body: Body): void;
  /** Where finder charts go; absent: the default chart output (see `defaultCharts`). */
  charts?: ChartOutput;
  /** The page's events: the week's, or those around a one-off's date (see `WeekData.eventsBetween`). */
  events(): AlmanacEvent[];
  /** How the page's event span is named in sentences: `this week` or `around this date`. */
  eventSpan: string;
  /** The event bound by an enclosing `:::every-event` (used by `:event` without a type). */
  event?: AlmanacEvent;
  /**
   * Records that a value placeholder had no value (it prints `FALLBACK_MARK`); `honest` is the
   * sentence saying why, `guard` the `:::provided` condition that would have guarded it (default
   * `has=<name> …`). The plugin turns it into a problem with the place, site and week.
   */
  fallback(honest: string, guard?: string): void;
  /** Table cells: print the honest phrase instead of the mark (a cell has room for it). */
  honest?: boolean;
}

export interface PlaceholderSpec {
  name: string;
  /** `inline` is written `:name{…}` inside a sentence; `block` is `::name{…}` on its own line. */
  form: 'inline' | 'block';
  /** One line for the placeholder table. */
  summary: string;
  attributes: Readonly<Record<string, AttributeSpec>>;
  /** An example as written in a template. */
  example: string;
  /**
   * A value slot: it can have no value (a body not visible, an event that does not happen), and
   * then prints `FALLBACK_MARK` and reports a fallback. Only slots can be tested with `:::provided{has=…}`.
   */
  slot?: boolean;
  /** Extra checks of the attributes against what an enclosing section binds (`bound`). */
  validate?: (attrs: ReadonlyMap<string, AttributeValue>, bound: Readonly<{ body: boolean; event: boolean }>) => void;
  render: (call: PlaceholderCall) => ElementContent;
}

let sharedCharts: ChartOutput | undefined;

/** The chart output used when a render gives none: a cache in `.cache/charts`, linked as `/charts/<file>`. */
export function defaultCharts(): ChartOutput {
  sharedCharts ??= { cache: new ChartCache({ dir: '.cache/charts' }), url: (file) => `/charts/${file}` };
  return sharedCharts;
}

// ---------------------------------------------------------------------------------------------
// Shared attributes

const NIGHT: AttributeSpec = { type: { kind: 'night' }, default: 'Monday, or the one-off date', doc: 'which night of the week' };
const CLOCK: AttributeSpec = { type: { kind: 'clock' }, default: "the site's locale", doc: '12- or 24-hour clock' };
const TIME_PRECISION: AttributeSpec = { type: { kind: 'time-precision' }, default: 'minute', doc: 'times are rounded to this' };
const BODY: AttributeSpec = { type: { kind: 'body' }, required: true, bound: 'body', doc: 'the body or object' };
const TWILIGHT: AttributeSpec = { type: { kind: 'choice', values: ['civil', 'nautical', 'astronomical'] }, default: 'astronomical', doc: 'which twilight' };
const DIGITS = (fallback: number, doc = 'decimals shown'): AttributeSpec => ({ type: { kind: 'integer', min: 0, max: 2 }, default: String(fallback), doc });

const TIME_ATTRS = { night: NIGHT, clock: CLOCK, precision: TIME_PRECISION };

// ---------------------------------------------------------------------------------------------
// Helpers

function classes(call: PlaceholderCall, ...extra: string[]): Properties {
  return { className: ['gl', `gl-${call.name}`, ...extra] };
}

function nightDate(call: PlaceholderCall): string {
  return call.week.week.days[call.night]!;
}

function precisionOf(call: PlaceholderCall): TimePrecision {
  return (call.attrs.get('precision') as TimePrecision | undefined) ?? 'minute';
}

function digitsOf(call: PlaceholderCall, fallback: number): number {
  return (call.attrs.get('precision') as number | undefined) ?? fallback;
}

function bodyOf(call: PlaceholderCall): Body {
  const body = call.attrs.get('body') as Body;
  if (body.kind !== 'sun' && call.week.elongationDeg(call.night, body) < NEAR_SUN_DEG) call.nearSun(body);
  return body;
}

/** An instant as `<time datetime="…">16:29</time>`. */
function timeElement(call: PlaceholderCall, instant: Date, data: Properties = {}): ElementContent {
  return el(
    'time',
    { ...classes(call), dateTime: formatInstant(instant, call.site.timeZone), dataNight: nightDate(call), ...data },
    formatClock(instant, call.site, { clock: call.clock, precision: precisionOf(call) }),
  );
}

/**
 * A value slot with no value: the neutral mark `–` (the honest sentence in its title and in the
 * problem report), or the sentence itself in a table cell. Says why in `data-reason`.
 */
function noValue(call: PlaceholderCall, honest: string, data: Properties = {}, guard?: string): ElementContent {
  if (call.honest) return el('span', { ...classes(call, 'gl-none'), dataNight: nightDate(call), ...data }, honest);
  call.fallback(honest, guard);
  return el('span', { ...classes(call, 'gl-none'), dataNight: nightDate(call), title: honest, ...data }, FALLBACK_MARK);
}

/** An event that does not happen this night. */
function missingElement(call: PlaceholderCall, reason: MissingReason, phrase: string, data: Properties = {}): ElementContent {
  return noValue(call, phrase, { dataReason: reason, ...data });
}

function eventElement(call: PlaceholderCall, event: EventTime, phrases: Record<MissingReason, string>, data: Properties = {}): ElementContent {
  return event.time ? timeElement(call, event.time, data) : missingElement(call, event.reason, phrases[event.reason], data);
}

const RISE_PHRASES: Record<MissingReason, string> = {
  'always-below': 'does not rise this night',
  'always-above': 'stays up all night',
  'outside-night': 'does not rise this night',
  'stays-above': 'stays up all night',
  'stays-below': 'does not rise this night',
};
const SET_PHRASES: Record<MissingReason, string> = {
  ...RISE_PHRASES,
  'always-above': 'does not set this night',
  'outside-night': 'does not set this night',
  'stays-above': 'does not set this night',
};
const TRANSIT_PHRASES: Record<MissingReason, string> = {
  'always-below': 'does not cross the meridian this night',
  'always-above': 'does not cross the meridian this night',
  'outside-night': 'does not cross the meridian this night',
  'stays-above': 'does not cross the meridian this night',
  'stays-below': 'does not cross the meridian this night',
};
const SUN_PHRASES: Record<MissingReason, string> = {
  'always-above': 'the Sun stays up all night',
  'stays-above': 'the Sun stays up all night',
  'always-below': 'the Sun stays below the horizon all day',
  'stays-below': 'the Sun stays below the horizon all day',
  'outside-night': 'not during this night',
};
const TWILIGHT_DEPTH_DEG = { civil: 6, nautical: 12, astronomical: 18 } as const;
type TwilightKind = keyof typeof TWILIGHT_DEPTH_DEG;

function twilightPhrases(kind: TwilightKind): Record<MissingReason, string> {
  const depth = TWILIGHT_DEPTH_DEG[kind];
  const light = `no ${kind} darkness this night: the Sun stays less than ${depth}° below the horizon`;
  const dark = `dark all day: the Sun stays more than ${depth}° below the horizon`;
  return { 'stays-above': light, 'always-above': light, 'stays-below': dark, 'always-below': dark, 'outside-night': 'not during this night' };
}

/** The instant of a moment attribute on the placeholder's night: a rise/transit/set event or a clock time. */
function momentOf(call: PlaceholderCall, body: Body): { event: EventTime; at: string; visibility?: Visibility } {
  const moment = call.attrs.get('at') as string | ClockTime;
  if (moment === 'best') {
    const v = call.week.bodyNight(call.night, body).visibility;
    return { event: v.best ? { time: v.best.time } : { time: null, reason: 'always-below' }, at: 'best', visibility: v };
  }
  if (typeof moment === 'string') {
    const bn = call.week.bodyNight(call.night, body);
    const event = moment === 'rise' ? bn.rise : moment === 'set' ? bn.set : bn.transit;
    return { event, at: moment };
  }
  // Clock times before noon belong to the morning after the evening date.
  const date = moment.hour < 12 ? addDays(nightDate(call), 1) : nightDate(call);
  const label = `${String(moment.hour).padStart(2, '0')}:${String(moment.minute).padStart(2, '0')}`;
  return { event: { time: zonedTime(date, moment.hour, moment.minute, call.site.timeZone) }, at: label };
}

function momentPhrases(at: string): Record<MissingReason, string> {
  return at === 'rise' ? RISE_PHRASES : at === 'set' ? SET_PHRASES : TRANSIT_PHRASES;
}

const PHASE_WORDS: Record<keyof typeof PHASE_LABEL, string> = Object.fromEntries(
  Object.entries(PHASE_LABEL).map(([k, v]) => [k, v.charAt(0).toLowerCase() + v.slice(1)]),
) as Record<keyof typeof PHASE_LABEL, string>;

// ---------------------------------------------------------------------------------------------
// Renderers

function sunTime(field: 'set' | 'rise') {
  return (call: PlaceholderCall): ElementContent => eventElement(call, call.week.nights[call.night]!.sun[field], SUN_PHRASES);
}

function twilight(edge: 'dusk' | 'dawn') {
  return (call: PlaceholderCall): ElementContent => {
    const kind = call.attrs.get('kind') as TwilightKind;
    const sun = call.week.nights[call.night]!.sun;
    const key = `${kind}${edge === 'dusk' ? 'Dusk' : 'Dawn'}` as const;
    return eventElement(call, sun[key], twilightPhrases(kind), { dataTwilight: kind });
  };
}

function bodyEvent(field: 'rise' | 'transit' | 'set') {
  const phrases = field === 'rise' ? RISE_PHRASES : field === 'set' ? SET_PHRASES : TRANSIT_PHRASES;
  return (call: PlaceholderCall): ElementContent => {
    const body = bodyOf(call);
    const event = call.week.bodyNight(call.night, body)[field];
    return eventElement(call, event, phrases, { dataBody: body.id });
  };
}

/** The honest phrase for a body with no best moment this night. */
function notVisible(call: PlaceholderCall, body: Body, v: Visibility, data: Properties = {}): ElementContent {
  const reason = v.reason ?? 'too-faint';
  return noValue(call, `${body.name} is not visible this night: ${reasonText(reason, call.site)}`, { dataBody: body.id, dataVerdict: v.verdict, dataReason: reason, ...data }, `seen=either body=${body.id}`);
}

function direction(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const { event, at, visibility } = momentOf(call, body);
  if (visibility && !visibility.best) return notVisible(call, body, visibility, { dataAt: at });
  if (!event.time) return missingElement(call, event.reason, momentPhrases(at)[event.reason], { dataBody: body.id, dataAt: at });
  const o = call.week.observe(body, event.time);
  const style = call.attrs.get('style') as string;
  const point = compass(o.azimuthDeg);
  let words = style === 'short' ? point.abbreviation : style === 'degrees' ? `${formatNumber(o.azimuthDeg, 0)}°` : point.word;
  if (typeof call.attrs.get('at') !== 'string' && o.altitudeDeg < 0) words += ' (below the horizon then)';
  return el(
    'data',
    { ...classes(call), value: exact(o.azimuthDeg, 2), dataBody: body.id, dataAt: at, dataAzimuthDeg: exact(o.azimuthDeg, 3), dataAltitudeDeg: exact(o.altitudeDeg, 3), dataTime: formatInstant(event.time, call.site.timeZone) },
    words,
  );
}

function altitude(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const { event, at, visibility } = momentOf(call, body);
  if (visibility && !visibility.best) return notVisible(call, body, visibility, { dataAt: at });
  if (!event.time) return missingElement(call, event.reason, momentPhrases(at)[event.reason], { dataBody: body.id, dataAt: at });
  const o = call.week.observe(body, event.time);
  const digits = digitsOf(call, 0);
  const deg = `${formatNumber(o.altitudeDeg, digits)}°`;
  const words = o.altitudeDeg < 0 ? `below the horizon (${deg})` : `${deg} (${handMeasure(o.altitudeDeg)})`;
  return el(
    'data',
    { ...classes(call, ...(o.altitudeDeg < 0 ? ['gl-below'] : [])), value: exact(o.altitudeDeg, 2), dataBody: body.id, dataAt: at, dataAltitudeDeg: exact(o.altitudeDeg, 3), dataFists: String(fists(o.altitudeDeg)), dataTime: formatInstant(event.time, call.site.timeZone) },
    words,
  );
}

function magnitude(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const m = call.week.magnitudes(body);
  const digits = digitsOf(call, 1);
  const band = m.brightest !== Math.min(...m.values) || m.faintest !== Math.max(...m.values) ? { dataBrightest: exact(m.brightest, 2), dataFaintest: exact(m.faintest, 2) } : {};
  if (call.given.has('night')) {
    const v = m.values[call.night]!;
    return el('data', { ...classes(call), value: exact(v, 2), dataBody: body.id, dataNight: nightDate(call), ...band }, formatNumber(v, digits));
  }
  const first = m.values[0]!;
  const last = m.values[6]!;
  const a = formatNumber(first, digits);
  const b = formatNumber(last, digits);
  const lo = Math.min(...m.values);
  const hi = Math.max(...m.values);
  // A range only when the week's change reaches one unit of the last digit shown (rounding alone must not make one).
  const text = hi - lo < 10 ** -digits || a === b ? a : `${a} to ${b}`;
  return el(
    'data',
    { ...classes(call), value: exact(first, 2), dataBody: body.id, dataWeek: call.week.week.id, dataMagnitudeFirst: exact(first, 2), dataMagnitudeLast: exact(last, 2), dataMagnitudeMin: exact(lo, 2), dataMagnitudeMax: exact(hi, 2), ...band },
    text,
  );
}

function moonPhase(call: PlaceholderCall): ElementContent {
  const p = call.week.nights[call.night]!.moon.phase;
  return el(
    'data',
    { ...classes(call), value: p.name, dataNight: nightDate(call), dataElongationDeg: exact(p.elongationDeg, 2), dataIlluminatedFraction: exact(p.illuminatedFraction, 4), dataAgeDays: exact(p.ageDays, 2) },
    PHASE_WORDS[p.name],
  );
}

function moonLit(call: PlaceholderCall): ElementContent {
  const f = call.week.nights[call.night]!.moon.phase.illuminatedFraction;
  return el('data', { ...classes(call), value: exact(f, 4), dataNight: nightDate(call) }, `${formatNumber(f * 100, digitsOf(call, 0))}%`);
}

function dateOf(call: PlaceholderCall): ElementContent {
  const date = nightDate(call);
  const weekday = call.attrs.get('style') === 'short' ? 'short' : 'long';
  return el('time', { ...classes(call), dateTime: date }, formatDay(date, call.site, { weekday }));
}

function weekOf(call: PlaceholderCall): ElementContent {
  const days = call.week.week.days;
  return el('time', { ...classes(call), dateTime: call.week.week.id }, formatDayRange(days[0]!, days[6]!, call.site));
}

function moonAndTwilight(call: PlaceholderCall): ElementContent {
  const kind = call.attrs.get('kind') as TwilightKind;
  const head = ['Night', 'Sunset', `End of ${kind} twilight`, `Start of ${kind} twilight`, 'Moonrise', 'Moonset', 'Moon'];
  const rows: ElementContent[] = call.week.nights.map((report, i) => {
    const cell = (child: ElementContent): ElementContent => el('td', {}, [child]);
    const sub: PlaceholderCall = { ...call, night: i, honest: true };
    const as = (name: string): PlaceholderCall => ({ ...sub, name });
    const p = report.moon.phase;
    return el('tr', { dataNight: report.night.date }, [
      el('th', { scope: 'row' }, [el('time', { dateTime: report.night.date }, formatDay(report.night.date, call.site, { weekday: 'short' }))]),
      cell(eventElement(as('sunset'), report.sun.set, SUN_PHRASES)),
      cell(eventElement(as('dark'), report.sun[`${kind}Dusk`], twilightPhrases(kind), { dataTwilight: kind })),
      cell(eventElement(as('dawn'), report.sun[`${kind}Dawn`], twilightPhrases(kind), { dataTwilight: kind })),
      cell(eventElement(as('rise'), report.moon.rise, RISE_PHRASES, { dataBody: 'moon' })),
      cell(eventElement(as('set'), report.moon.set, SET_PHRASES, { dataBody: 'moon' })),
      cell(el('data', { className: ['gl', 'gl-moon-phase'], value: p.name, dataIlluminatedFraction: exact(p.illuminatedFraction, 4) }, `${PHASE_WORDS[p.name]}, ${formatNumber(p.illuminatedFraction * 100, 0)}% lit`)),
    ]);
  });
  const days = call.week.week.days;
  return el('figure', { ...classes(call), dataWeek: call.week.week.id }, [
    el('table', {}, [
      el('caption', {}, `Sun, twilight and Moon at ${call.site.name}, ${formatDayRange(days[0]!, days[6]!, call.site)} (local time)`),
      el('thead', {}, [el('tr', {}, head.map((h) => el('th', { scope: 'col' }, h)))]),
      el('tbody', {}, rows),
    ]),
  ]);
}

function visibilityData(v: Visibility): Properties {
  return {
    dataVerdict: v.verdict,
    ...(v.best ? { dataMargin: exact(v.best.margin, 2), dataRequiredMargin: exact(v.best.requiredMargin, 2), dataAltitudeDeg: exact(v.best.altitudeDeg, 3), dataAzimuthDeg: exact(v.best.azimuthDeg, 3) } : {}),
    ...(v.outsideViewingHours ? { dataOutsideViewingHours: 'true' } : {}),
  };
}

function bestTime(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const v = call.week.bodyNight(call.night, body).visibility;
  if (!v.best) return notVisible(call, body, v);
  const time = timeElement(call, v.best.time, { dataBody: body.id, ...visibilityData(v) });
  // A morning object: say so, so a reader does not plan on it during the evening viewing hours.
  if (!v.outsideViewingHours) return time;
  return el('span', { className: ['gl-after-hours'] }, [time, { type: 'text', value: ' (after the viewing hours)' }]);
}

function viewingWindow(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const v = call.week.bodyNight(call.night, body).visibility;
  if (!v.window) return notVisible(call, body, v);
  const zone = call.site.timeZone;
  const format = { clock: call.clock, precision: precisionOf(call) };
  // An optics window cut short for safety says so, so nobody keeps sweeping towards the rising Sun.
  const why: ElementContent[] = v.window.endReason === 'optics-safety' ? [{ type: 'text', value: `, when ${WINDOW_END_TEXT['optics-safety']}` }] : [];
  return el('span', { ...classes(call), dataNight: nightDate(call), dataBody: body.id, dataEndReason: v.window.endReason, ...visibilityData(v) }, [
    el('time', { dateTime: formatInstant(v.window.start, zone) }, formatClock(v.window.start, call.site, format)),
    { type: 'text', value: '\u2013' },
    el('time', { dateTime: formatInstant(v.window.end, zone) }, formatClock(v.window.end, call.site, format)),
    ...why,
  ]);
}

function verdict(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const v = call.week.bodyNight(call.night, body).visibility;
  const words = v.verdict === 'not-visible' ? `not visible this night: ${reasonText(v.reason ?? 'too-faint', call.site)}` : VERDICT_WORDS[v.verdict];
  return el('data', { ...classes(call), value: v.verdict, dataNight: nightDate(call), dataBody: body.id, ...(v.reason ? { dataReason: v.reason } : {}), ...visibilityData(v) }, words);
}

function guide(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const g = call.week.bodyNight(call.night, body).guide;
  if (!g) return noValue(call, `${body.name} is below the horizon at that time`, { dataBody: body.id });
  return el(
    'span',
    { ...classes(call), dataNight: nightDate(call), dataBody: body.id, dataGuide: g.kind, ...(g.pattern ? { dataPattern: g.pattern.id } : {}), ...(g.separationDeg !== null ? { dataSeparationDeg: exact(g.separationDeg, 2) } : {}), ...(g.offsetDirection ? { dataOffset: g.offsetDirection } : {}), ...(g.nearestStar ? { dataNearestStar: g.nearestStar.name } : {}) },
    g.phrase,
  );
}

/** Every naked-eye or binocular target of the night, by best time. Bodies come from the week's registry. */
function targets(call: PlaceholderCall): ElementContent {
  const zone = call.site.timeZone;
  const format = { clock: call.clock, precision: precisionOf(call) };
  const rows = call.week.bodies
    .ids()
    .filter((id) => id !== 'sun')
    .map((id) => call.week.bodyNight(call.night, call.week.bodies.get(id)))
    .filter((bn) => bn.visibility.best && (bn.visibility.verdict === 'naked-eye' || bn.visibility.verdict === 'binoculars'))
    .sort((a, b) => a.visibility.best!.time.getTime() - b.visibility.best!.time.getTime() || (a.body.id < b.body.id ? -1 : 1));
  if (rows.length === 0) {
    return el('p', { ...classes(call, 'gl-none'), dataNight: nightDate(call) }, 'No naked-eye or binocular targets this night.');
  }
  const items = rows.map((bn) => {
    const v = bn.visibility;
    const best = v.best!;
    if (bn.body.kind !== 'sun' && call.week.elongationDeg(call.night, bn.body) < NEAR_SUN_DEG) call.nearSun(bn.body);
    return el('li', { dataBody: bn.body.id, ...visibilityData(v) }, [
      el('strong', {}, bn.body.name),
      { type: 'text', value: ': best at ' },
      el('time', { dateTime: formatInstant(best.time, zone) }, formatClock(best.time, call.site, format)),
      { type: 'text', value: `, ${compass(best.azimuthDeg).word}, ${formatNumber(best.altitudeDeg, 0)}° (${handMeasure(best.altitudeDeg)}) up, magnitude ` },
      el('data', { value: exact(best.magnitude, 2) }, formatNumber(best.magnitude, 1)),
      { type: 'text', value: `${bn.guide ? `, ${bn.guide.phrase}` : ''} \u2014 ${VERDICT_WORDS[v.verdict as keyof typeof VERDICT_WORDS]}${v.outsideViewingHours ? ' (outside the viewing hours)' : ''}` },
    ]);
  });
  return el('ul', { ...classes(call), dataNight: nightDate(call) }, items);
}

// ---------------------------------------------------------------------------------------------
// The table

const DEFINITIONS: PlaceholderSpec[] = [
  { name: 'week', form: 'inline', summary: "the page's week as a date range", attributes: {}, example: ':week', render: weekOf },
  { name: 'date', form: 'inline', summary: 'the date of a night of the week', attributes: { night: NIGHT, style: { type: { kind: 'choice', values: ['long', 'short'] }, default: 'long', doc: 'weekday and month written out or abbreviated' } }, example: ':date{night=fri}', render: dateOf },
  { name: 'sunset', form: 'inline', slot: true, summary: 'sunset (upper limb on the horizon, standard refraction)', attributes: TIME_ATTRS, example: ':sunset{night=sat}', render: sunTime('set') },
  { name: 'sunrise', form: 'inline', slot: true, summary: 'sunrise the morning after the night', attributes: TIME_ATTRS, example: ':sunrise', render: sunTime('rise') },
  { name: 'dark', form: 'inline', slot: true, summary: 'end of evening twilight (Sun 6°, 12° or 18° below the horizon)', attributes: { kind: TWILIGHT, ...TIME_ATTRS }, example: ':dark{kind=nautical}', render: twilight('dusk') },
  { name: 'dawn', form: 'inline', slot: true, summary: 'start of morning twilight', attributes: { kind: TWILIGHT, ...TIME_ATTRS }, example: ':dawn', render: twilight('dawn') },
  { name: 'rise', form: 'inline', slot: true, summary: 'rise time of a body (or an honest phrase when it does not rise)', attributes: { body: BODY, ...TIME_ATTRS }, example: ':rise{body=jupiter}', render: bodyEvent('rise') },
  { name: 'transit', form: 'inline', slot: true, summary: 'time a body crosses the meridian, highest in the sky', attributes: { body: BODY, ...TIME_ATTRS }, example: ':transit{body=saturn}', render: bodyEvent('transit') },
  { name: 'set', form: 'inline', slot: true, summary: 'set time of a body', attributes: { body: BODY, ...TIME_ATTRS }, example: ':set{body=moon night=3}', render: bodyEvent('set') },
  {
    name: 'direction',
    form: 'inline',
    slot: true,
    summary: 'compass direction of a body at a moment',
    attributes: {
      body: BODY,
      at: { type: { kind: 'moment', values: ['best', 'rise', 'transit', 'set'] }, required: true, doc: 'the moment (a clock time before 12:00 is the next morning)' },
      style: { type: { kind: 'choice', values: ['word', 'short', 'degrees'] }, default: 'word', doc: 'west-southwest, WSW or 247°' },
      night: NIGHT,
    },
    example: ':direction{body=jupiter at=best}',
    render: direction,
  },
  {
    name: 'altitude',
    form: 'inline',
    slot: true,
    summary: 'height above the horizon in degrees and fists (apparent, with refraction)',
    attributes: {
      body: BODY,
      at: { type: { kind: 'moment', values: ['best', 'transit'] }, required: true, doc: 'the moment (a clock time before 12:00 is the next morning)' },
      precision: DIGITS(0),
      night: NIGHT,
    },
    example: ':altitude{body=jupiter at=21:00}',
    render: altitude,
  },
  { name: 'magnitude', form: 'inline', summary: 'expected magnitude: over the week (a range when it changes), or on one night', attributes: { body: BODY, night: { ...NIGHT, default: 'the whole week' }, precision: DIGITS(1) }, example: ':magnitude{body=mars}', render: magnitude },
  { name: 'moon-phase', form: 'inline', summary: "the Moon's phase at local midnight", attributes: { night: NIGHT }, example: ':moon-phase{night=sun}', render: moonPhase },
  { name: 'moon-lit', form: 'inline', summary: "the lit fraction of the Moon's disc at local midnight, in per cent", attributes: { night: NIGHT, precision: DIGITS(0) }, example: ':moon-lit', render: moonLit },
  { name: 'moon-and-twilight', form: 'block', summary: 'a table of the week: sunset, twilight, moonrise, moonset and phase for each night', attributes: { kind: TWILIGHT, clock: CLOCK, precision: TIME_PRECISION }, example: '::moon-and-twilight', render: moonAndTwilight },
  { name: 'best-time', form: 'inline', slot: true, summary: 'best viewing time: largest visibility margin within the viewing hours (lib/models/visibility.ts)', attributes: { body: BODY, ...TIME_ATTRS }, example: ':best-time{body=jupiter}', render: bestTime },
  { name: 'window', form: 'inline', slot: true, summary: 'viewing window: the span around the best time where the body stays visible', attributes: { body: BODY, ...TIME_ATTRS }, example: ':window{body=jupiter}', render: viewingWindow },
  { name: 'verdict', form: 'inline', summary: 'naked eye, binoculars, telescope or not visible, with the reason', attributes: { body: BODY, night: NIGHT }, example: ':verdict{body=saturn}', render: verdict },
  { name: 'guide', form: 'inline', slot: true, summary: 'where to look, at the best time (or transit): from a nearby star pattern, a bright star, the Moon or a bright planet, or else the horizon and where the Sun set', attributes: { body: BODY, night: NIGHT }, example: ':guide{body=jupiter}', render: guide },
  { name: 'targets', form: 'block', summary: 'every naked-eye or binocular target of the night, by best time, with direction, altitude, magnitude and nearby pattern', attributes: { ...TIME_ATTRS }, example: '::targets{night=fri}', render: targets },
  {
    name: 'chart',
    form: 'block',
    summary: 'a finder chart: the view facing the body at its best time with its track over the week, or the whole sky at the end of nautical twilight',
    attributes: { body: BODY, night: NIGHT, view: { type: { kind: 'choice', values: ['horizon', 'sky'] }, default: 'horizon', doc: 'facing the body, or the whole sky' } },
    example: '::chart{body=jupiter}',
    render: chart,
  },
  {
    name: 'events',
    form: 'block',
    summary: "the week's events for the site (Moon phases, close approaches, oppositions, showers, eclipses …) with a sentence and a visibility note each",
    attributes: { order: { type: { kind: 'choice', values: ['time', 'interest'] }, default: 'time', doc: 'in time order, or most interesting first' }, clock: CLOCK },
    example: '::events{order=interest}',
    render: weekEvents,
  },
  {
    name: 'event',
    form: 'inline',
    summary: "one event of the week (or around a one-off's date), found by type (and body), or the event of an enclosing :::every-event: its time, date, separation, sentence or title",
    slot: true,
    attributes: {
      // Bulletin weeks carry no satellites yet: satellite passes are in `gloaming events` and the calendar feed.
      type: { type: { kind: 'choice', values: EVENT_TYPES.filter((t) => t !== 'satellite-pass') }, required: true, bound: 'event', doc: 'the event type' },
      body: { ...BODY, required: false, doc: 'a body the event must involve' },
      show: { type: { kind: 'choice', values: ['time', 'date', 'separation', 'sentence', 'title'] }, default: 'time', doc: 'what to show' },
      clock: CLOCK,
    },
    example: ':event{type=full-moon show=date}',
    render: oneEvent,
  },
  {
    name: 'name',
    form: 'inline',
    summary: 'the name of a body, or of the body or event an enclosing :::every-target or :::every-event is about',
    attributes: { body: { ...BODY, required: false } },
    example: ':name{body=moon}',
    validate: (attrs, bound) => {
      if (!attrs.has('body') && !bound.body && !bound.event) {
        throw new GloamingError('invalid-placeholder', "':name' has nothing to name here", { place: { field: 'body' }, hint: 'give body=… or put it inside :::every-target or :::every-event' });
      }
    },
    render: nameOf,
  },
];

/** One almanac event as a list item: time, sentence, visibility note and any caution. */
function eventItem(call: PlaceholderCall, e: AlmanacEvent): ElementContent {
  const zone = call.site.timeZone;
  const children: ElementContent[] = [
    el('time', { dateTime: formatInstant(e.time, zone) }, `${formatDay(localDateOf(e.time, zone), call.site, { weekday: 'short' })} ${formatClock(e.time, call.site, { clock: call.clock, precision: 'minute' })}`),
    { type: 'text', value: ' ' },
    el('span', { className: ['gl-event-text'] }, e.description),
  ];
  // A visible event's sentence already says when and where to look; a hidden one gets its reason.
  if (!e.visible && e.visibility.note && !e.description.includes(e.visibility.note)) children.push({ type: 'text', value: ' ' }, el('span', { className: ['gl-event-note'] }, e.visibility.note));
  if (e.caution) children.push({ type: 'text', value: ' ' }, el('strong', { className: ['gl-caution'] }, e.caution));
  return el('li', { dataType: e.type, dataVisible: String(e.visible), dataBodies: e.bodies.join(' ') }, children);
}

/** `::events`: the week's events for the site. */
function weekEvents(call: PlaceholderCall): ElementContent {
  const order = call.attrs.get('order') as 'time' | 'interest';
  const events = [...call.events()];
  if (order === 'interest') events.sort((a, b) => b.score - a.score || a.time.getTime() - b.time.getTime());
  if (events.length === 0) return el('p', { ...classes(call, 'gl-none') }, `No special events ${call.eventSpan}.`);
  return el('ul', { ...classes(call), dataOrder: order }, events.map((e) => eventItem(call, e)));
}

/** `:event`: one event of the page's span picked by type (and body), or the event bound by `:::every-event`. */
function oneEvent(call: PlaceholderCall): ElementContent {
  const type = call.attrs.get('type') as AlmanacEventType | undefined;
  const body = call.attrs.get('body') as Body | undefined;
  const e = type === undefined ? (call.event ?? null) : pickEvent(call.events(), { type, ...(body ? { bodies: [body.id] } : {}) });
  if (!e) return noValue(call, `no ${(type ?? 'event').replace(/-/g, ' ')}${body ? ` involving ${body.name}` : ''} ${call.eventSpan}`, { dataType: type ?? '' }, `event=${type ?? '…'}${body ? ` body=${body.id}` : ''}`);
  const zone = call.site.timeZone;
  const data = { ...classes(call), dataType: e.type, dataVisible: String(e.visible) };
  switch (call.attrs.get('show')) {
    case 'date':
      return el('time', { ...data, dateTime: localDateOf(e.time, zone) }, formatDay(localDateOf(e.time, zone), call.site, { weekday: 'long' }));
    case 'separation':
      return e.separationDeg === undefined
        ? noValue(call, `no separation for ${e.title}`, { dataType: e.type })
        : el('data', { ...data, value: exact(e.separationDeg, 4) }, `${formatNumber(e.separationDeg, e.separationDeg < 1 ? 1 : 0)}°`);
    case 'sentence':
      return el('span', data, e.description);
    case 'title':
      return el('span', data, e.title);
    default:
      return el('time', { ...data, dateTime: formatInstant(e.time, zone) }, formatClock(e.time, call.site, { clock: call.clock, precision: 'minute' }));
  }
}

/** `:name`: the name of a body, or of the body or event an enclosing section binds. */
function nameOf(call: PlaceholderCall): ElementContent {
  const body = call.attrs.get('body') as Body | undefined;
  if (body) return el('span', { ...classes(call), dataBody: body.id }, body.kind === 'moon' ? 'the Moon' : body.name);
  const e = call.event!;
  return el('span', { ...classes(call), dataType: e.type }, e.title);
}

/** `::chart`: a figure with the finder chart image and a caption, or an honest sentence. */
function chart(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const output = call.charts ?? defaultCharts();
  const visibility = call.week.bodyNight(call.night, body).visibility;
  const r = placeholderChart({
    site: call.site,
    body,
    report: call.week.nights[call.night]!,
    visibility,
    nightIndex: call.night,
    view: call.attrs.get('view') as 'horizon' | 'sky',
    cache: output.cache,
    url: output.url,
  });
  if (r.kind === 'not-visible') {
    return el('p', { ...classes(call, 'gl-none'), dataReason: visibility.reason ?? 'not-visible' }, `No finder chart for ${body.name} this night: ${r.reason}.`);
  }
  const c = r.chart;
  const caption = c.alt.split(/(?<=\.)\s/)[0] ?? c.alt;
  return el('figure', { ...classes(call), dataChart: c.key, dataBody: body.id, dataNight: nightDate(call) }, [
    el('img', { src: output.url(c.files.svg), width: c.width, height: c.height, loading: 'lazy', decoding: 'async', alt: c.alt }),
    el('figcaption', {}, caption),
  ]);
}

/** Every placeholder by name. */
export const PLACEHOLDERS: ReadonlyMap<string, PlaceholderSpec> = new Map(DEFINITIONS.map((d) => [d.name, d]));
