/** The organisation publishing the bulletins. The demo's centre is invented and says so. */
export const CENTRE = {
  name: 'Quayside Lantern Science Centre',
  shortName: 'Quayside Lantern',
  /** Shown on every page of the demo. */
  inventedNote: 'The Quayside Lantern Science Centre and its three observing sites are invented for this demo of gloaming.',
} as const;
