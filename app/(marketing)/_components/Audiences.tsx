const AUDIENCES = [
  {
    who: 'Lead coach or physio',
    what: 'Runs the team, invites coaches, reviewers and athletes, and decides what gets published under the team’s name.',
  },
  {
    who: 'Coaches and peer reviewers',
    what: 'Write the reviews, link and appraise the studies, and check each other’s scores before anything reaches an athlete.',
  },
  {
    who: 'Athletes',
    what: 'Read the team’s verdicts and search past ones, in language written for them rather than for a journal.',
  },
];

export function Audiences() {
  return (
    <section aria-labelledby="audiences-heading" className="border-line bg-paper-sunken border-y">
      <div className="max-w-shell px-gutter py-section mx-auto">
        <h2 id="audiences-heading" className="text-3xl font-semibold">
          One team, three kinds of work
        </h2>
        <ul className="mt-8 grid gap-4 md:grid-cols-3">
          {AUDIENCES.map((a) => (
            <li key={a.who} className="border-line bg-paper-raised shadow-card rounded-lg border p-5">
              <h3 className="text-lg font-semibold">{a.who}</h3>
              <p className="text-ink-muted mt-2 text-sm">{a.what}</p>
            </li>
          ))}
        </ul>
      </div>
    </section>
  );
}
