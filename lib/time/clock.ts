/** What services and jobs ask for the time: the real clock, or a test's fixed one. */
export type Clock = () => Date;

export const systemClock: Clock = () => new Date();
