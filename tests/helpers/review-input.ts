/** A review as a coach sends it to POST /api/reviews (a dose the model can check). */
export const protocol = {
  exercise: 'Hangboard half-crimp hang',
  loadValue: 10,
  loadUnit: 'kg-added',
  referenceBodyweightKg: 70,
  referenceMaxAddedKg: 30,
  secondsPerSet: 10,
  setsPerSession: 6,
  sessionsPerDay: 2,
  daysPerWeek: 4,
  minHoursBetween: 6,
  weeks: 8,
  effort: 'hard',
};

export const newReview = (teamId: number, extra: Record<string, unknown> = {}) => ({
  teamId,
  claim: 'Light daily hangs make fingers stronger in eight weeks.',
  claimSource: 'A video on a climbing channel',
  claimUrl: 'https://video.example.test/hangs',
  protocol,
  population: { status: 'recreational', injured: false },
  tags: ['Fingers', 'hangboard'],
  ...extra,
});
