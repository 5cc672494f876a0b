/**
 * Interest score: an editorial ranking, 0–100, of how much an event is worth a reader's evening.
 * These weights are gloaming's own choice (no published source): rare and striking events
 * (eclipses, rich meteor showers, bright close pairs) rank above monthly ones (phases, apsides);
 * an event that cannot be seen from the site keeps 35% of its score so it can still be mentioned.
 */
import type { AlmanacEvent } from './types.ts';

const OPPOSITION: Record<string, number> = { mars: 75, jupiter: 70, saturn: 65, uranus: 25, neptune: 20 };
const BASE: Partial<Record<AlmanacEvent['type'], number>> = {
  'new-moon': 30,
  'full-moon': 30,
  'first-quarter': 20,
  'last-quarter': 20,
  apogee: 5,
  equinox: 35,
  solstice: 35,
  conjunction: 15,
  'greatest-brilliancy': 50,
};
/** Share of the score kept by an event that cannot be seen from the site. */
export const HIDDEN_SHARE = 0.35;

function closeness(separationDeg: number, limitDeg: number): number {
  return Math.max(0, 1 - separationDeg / limitDeg);
}

/** The score of one event (see the module note for the weights). */
export function interestScore(event: AlmanacEvent): number {
  let s = BASE[event.type] ?? 0;
  const first = event.bodies[0] ?? '';
  const magA = Number(event.data?.magnitudeA ?? 5);
  const magB = Number(event.data?.magnitudeB ?? 5);
  switch (event.type) {
    case 'solar-eclipse':
      s = event.eclipse?.kind === 'total' ? 100 : event.eclipse?.kind === 'annular' ? 95 : 60 + 30 * (event.eclipse?.obscuration ?? 0);
      break;
    case 'lunar-eclipse':
      s = event.eclipse?.kind === 'total' ? 95 : event.eclipse?.kind === 'partial' ? 75 : 35;
      break;
    case 'meteor-shower-peak':
      s = Math.min(90, 30 + 1.2 * (event.shower?.best?.hourlyRate ?? 0));
      break;
    case 'close-approach': {
      const sep = event.separationDeg ?? 5;
      const bright = (magA < 1 ? 5 : 0) + (magB < 1 ? 5 : 0);
      const star = event.bodies.some((b) => b.startsWith('star:'));
      if (first === 'moon') s = (star ? 30 : 45) + 20 * closeness(sep, 4) + bright;
      else s = (star ? 35 : 50) + 25 * closeness(sep, 3) + bright;
      break;
    }
    case 'opposition':
      s = OPPOSITION[first] ?? 30;
      break;
    case 'greatest-elongation':
      s = first === 'venus' ? 60 : 55;
      break;
    case 'perigee':
      s = Number(event.data?.daysFromFullMoon ?? 99) < 1.5 ? 30 : 15;
      break;
    case 'stationary':
      s = first === 'mars' ? 20 : 10;
      break;
    case 'perihelion':
    case 'closest-approach-to-earth':
    case 'peak-brightness': {
      const mag = Number(event.data?.magnitude ?? 12);
      s = (event.type === 'peak-brightness' ? 50 : 40) + (mag <= 5 ? 25 : mag <= 8 ? 10 : 0);
      break;
    }
    case 'satellite-pass': {
      // Only naked-eye passes are events; the bright ones are the ones people remember.
      const mag = Number(event.data?.magnitude ?? 4);
      s = 30 + (mag <= -1 ? 15 : mag <= 1 ? 8 : 0);
      break;
    }
    case 'variable-minimum':
      // A naked-eye change anyone can follow over an evening, every few days.
      s = 25;
      break;
    case 'occultation': {
      // A planet or a first-magnitude star winking out is memorable; fainter stars need optics. Grazes are rarer still.
      const mag = Number(event.data?.magnitude ?? 4);
      s = (mag <= 1.5 ? 65 : mag <= 3 ? 45 : 35) + (event.data?.graze === 'yes' ? 10 : 0);
      break;
    }
    default:
      break;
  }
  const seasonal = event.type === 'equinox' || event.type === 'solstice' || event.type === 'conjunction';
  const final = event.visible || seasonal ? s : s * HIDDEN_SHARE;
  return Math.round(Math.min(100, Math.max(0, final)));
}
