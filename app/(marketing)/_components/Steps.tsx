const STEPS = [
  {
    title: 'Pin the claim down',
    body: 'One sentence, who said it and where, and the protocol as a dose: load as a share of maximum, time under load, sets, sessions, rest, weeks, effort and who it was meant for.',
  },
  {
    title: 'List what could explain it',
    body: 'Neural drive, muscle growth, tendon stiffness, pain and confidence, technique, sleep, expectation: each mechanism with the stimulus it needs, checked against the dose.',
  },
  {
    title: 'Weigh the studies',
    body: 'One evidence library per team. Appraise each study against each mechanism for bias, consistency, directness and precision, and pool effect sizes where they belong together.',
  },
  {
    title: 'Score it blind',
    body: 'Peer reviewers score every mechanism without seeing each other. The app measures how far they agree and flags the mechanisms they do not, for the author to settle.',
  },
  {
    title: 'Publish for athletes',
    body: 'A verdict page in plain words: what probably works and why, who should and should not try it, the cautions, and the references. Every published version is kept.',
  },
];

export function Steps() {
  return (
    <section aria-labelledby="steps-heading" className="max-w-shell px-gutter py-section mx-auto">
      <h2 id="steps-heading" className="text-3xl font-semibold">
        From a claim to a verdict you can stand behind
      </h2>
      <p className="max-w-measure text-ink-muted mt-3">
        The same five steps for every claim, so two coaches looking at the same protocol reach the same kind of answer,
        and can show how they got there.
      </p>
      <ol className="mt-10 grid gap-x-6 gap-y-8 sm:grid-cols-2 lg:grid-cols-5">
        {STEPS.map((step, i) => (
          <li key={step.title} className="border-granite-700 border-t-2 pt-4">
            <p className="font-display text-accent-text text-sm font-semibold" aria-hidden="true">
              {String(i + 1).padStart(2, '0')}
            </p>
            <h3 className="mt-1 text-lg font-semibold">{step.title}</h3>
            <p className="text-ink-muted mt-2 text-sm">{step.body}</p>
          </li>
        ))}
      </ol>
    </section>
  );
}
