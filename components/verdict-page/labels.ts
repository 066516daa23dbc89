const DATE = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** "3 December 2026": the same on the server and in every reader's time zone (dates are UTC). */
export function longDate(iso: string): string {
  return DATE.format(new Date(iso));
}

export const percent = (x: number) => `${Math.round(x * 100)} %`;
