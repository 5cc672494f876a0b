/** Deep-sky objects: the night's well-placed clusters, nebulae, galaxies and double stars (lib/models/deep-sky/placed.ts). */
import type { ElementContent } from 'hast';
import { wellPlaced, type WellPlaced } from '../../../models/deep-sky/placed.ts';
import { el } from '../format.ts';
import { TIME_ATTRS, classes, nightDate, wordsOf, type PlaceholderCall, type PlaceholderSpec } from './call.ts';
import { targetItem } from './visibility.ts';

/** How many objects the list shows by default. */
const DEFAULT_LIMIT = 6;

function placed(call: PlaceholderCall): WellPlaced {
  const limit = Number(call.attrs.get('limit') ?? DEFAULT_LIMIT);
  return call.week.derived(`deep-sky:${call.night}:${limit}`, (week) => wellPlaced(week.nights[call.night]!, { limit }));
}

/** The night's well-placed deep-sky objects, best first, each with what it is, best time, direction, guide and verdict. */
function deepSky(call: PlaceholderCall): ElementContent {
  const words = wordsOf(call);
  const list = placed(call);
  if (list.objects.length === 0) {
    const why = list.dark ? 'ph.deep-sky-none' : 'ph.deep-sky-no-dark';
    return el('p', { ...classes(call, 'gl-none'), dataNight: nightDate(call), dataReason: list.dark ? 'none-high' : 'no-darkness' }, words.t(why));
  }
  const items = list.objects.map((p) => targetItem(call, p.night, words.t(`deep-sky.${p.object.type}`)));
  return el('ul', { ...classes(call), dataNight: nightDate(call) }, items);
}

export const DEEP_SKY_PLACEHOLDERS: PlaceholderSpec[] = [
  {
    name: 'deep-sky',
    form: 'block',
    summary:
      'the deep-sky objects well placed this night: at least 30° up while the sky is fully dark within the viewing hours and recommended by the visibility model, best first (least aid, then margin), with what each is, best time, direction, magnitude, nearby pattern and verdict',
    attributes: { ...TIME_ATTRS, limit: { type: { kind: 'integer', min: 1, max: 20 }, default: String(DEFAULT_LIMIT), doc: 'how many objects at most' } },
    example: '::deep-sky{night=fri limit=5}',
    shows: (call) => placed(call).objects.map((p) => p.night.body),
    render: deepSky,
  },
];
