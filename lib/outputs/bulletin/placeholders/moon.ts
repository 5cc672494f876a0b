/** The Moon: its phase and lit fraction, and the week's table of sunset, twilight and the Moon. */
import type { ElementContent } from 'hast';
import { printedLitFraction } from '../../../core/moon.ts';
import { el, exact, formatDay, formatDayRange } from '../format.ts';
import { CLOCK, DIGITS, NIGHT, TIME_PRECISION, TWILIGHT, classes, digitsOf, eventElement, nightDate, wordsOf, type PlaceholderCall, type PlaceholderSpec } from './call.ts';
import { RISE_PHRASES, SET_PHRASES, SUN_PHRASES, type TwilightKind } from './phrases.ts';

function moonPhase(call: PlaceholderCall): ElementContent {
  const p = call.week.nights[call.night]!.moon.phase;
  return el(
    'data',
    { ...classes(call), value: p.name, dataNight: nightDate(call), dataElongationDeg: exact(p.elongationDeg, 2), dataIlluminatedFraction: exact(p.illuminatedFraction, 4), dataAgeDays: exact(p.ageDays, 2) },
    wordsOf(call).t(`phase-word.${p.name}`),
  );
}

function moonLit(call: PlaceholderCall): ElementContent {
  const phase = call.week.nights[call.night]!.moon.phase;
  const digits = digitsOf(call, 0);
  return el('data', { ...classes(call), value: exact(phase.illuminatedFraction, 4), dataNight: nightDate(call) }, wordsOf(call).percent(printedLitFraction(phase, digits), digits));
}

function moonAndTwilight(call: PlaceholderCall): ElementContent {
  const kind = call.attrs.get('kind') as TwilightKind;
  const words = wordsOf(call);
  const head = [words.t('ph.table-night'), words.t('ph.table-sunset'), words.t('ph.table-twilight-end', { kind }), words.t('ph.table-twilight-start', { kind }), words.t('ph.table-moonrise'), words.t('ph.table-moonset'), words.t('ph.table-moon')];
  const rows: ElementContent[] = call.week.nights.map((report, i) => {
    const cell = (child: ElementContent): ElementContent => el('td', {}, [child]);
    const sub: PlaceholderCall = { ...call, night: i, honest: true };
    const as = (name: string): PlaceholderCall => ({ ...sub, name });
    const p = report.moon.phase;
    return el('tr', { dataNight: report.night.date }, [
      el('th', { scope: 'row' }, [el('time', { dateTime: report.night.date }, formatDay(report.night.date, call.site, { weekday: 'short' }))]),
      cell(eventElement(as('sunset'), report.sun.set, SUN_PHRASES)),
      cell(eventElement(as('dark'), report.sun[`${kind}Dusk`], kind, { dataTwilight: kind })),
      cell(eventElement(as('dawn'), report.sun[`${kind}Dawn`], kind, { dataTwilight: kind })),
      cell(eventElement(as('rise'), report.moon.rise, RISE_PHRASES, { dataBody: 'moon' })),
      cell(eventElement(as('set'), report.moon.set, SET_PHRASES, { dataBody: 'moon' })),
      cell(el('data', { className: ['gl', 'gl-moon-phase'], value: p.name, dataIlluminatedFraction: exact(p.illuminatedFraction, 4) }, words.t('ph.table-moon-cell', { phase: words.t(`phase-word.${p.name}`), percent: words.percent(printedLitFraction(p)) }))),
    ]);
  });
  const days = call.week.week.days;
  return el('figure', { ...classes(call), dataWeek: call.week.week.id }, [
    el('table', {}, [
      el('caption', {}, words.t('ph.table-caption', { site: call.site.name, dates: formatDayRange(days[0]!, days[6]!, call.site) })),
      el('thead', {}, [el('tr', {}, head.map((h) => el('th', { scope: 'col' }, h)))]),
      el('tbody', {}, rows),
    ]),
  ]);
}

export const MOON_PLACEHOLDERS: PlaceholderSpec[] = [
  { name: 'moon-phase', form: 'inline', summary: "the Moon's phase at local midnight", attributes: { night: NIGHT }, example: ':moon-phase{night=sun}', render: moonPhase },
  { name: 'moon-lit', form: 'inline', summary: "the lit fraction of the Moon's disc at local midnight, in per cent", attributes: { night: NIGHT, precision: DIGITS(0) }, example: ':moon-lit', render: moonLit },
  { name: 'moon-and-twilight', form: 'block', summary: 'a table of the week: sunset, twilight, moonrise, moonset and phase for each night', attributes: { kind: TWILIGHT, clock: CLOCK, precision: TIME_PRECISION }, example: '::moon-and-twilight', render: moonAndTwilight },
];
