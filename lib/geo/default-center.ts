/** The demo town's centre, where maps open (and a council's demand map looks) when nothing else is known. */
export const DEFAULT_CENTER = { lat: 52.205, lng: 0.847 } as const;
