import type { ReceivedMail } from '@/lib/mail/fake-smtp';

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'medium' });

function linksIn(text: string): string[] {
  return [...new Set(text.match(/https?:\/\/[^\s<>"')]+/g) ?? [])];
}

/** One received mail: who it went to, when, its text part, and its links ready to click. */
export function MailCard({ mail }: { mail: ReceivedMail }) {
  const links = linksIn(mail.text);
  return (
    <article className="border-line bg-paper-raised shadow-card rounded-lg border" data-testid="dev-mail">
      <header className="border-line border-b px-5 py-3">
        <h2 className="text-lg font-semibold break-words">{mail.subject || '(no subject)'}</h2>
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="text-ink-muted">To</dt>
          <dd className="break-all">{mail.to.join(', ')}</dd>
          <dt className="text-ink-muted">From</dt>
          <dd className="break-all">{mail.from}</dd>
          <dt className="text-ink-muted">Received</dt>
          <dd>
            <time dateTime={mail.receivedAt}>{when.format(new Date(mail.receivedAt))}</time>
          </dd>
        </dl>
      </header>
      <div className="space-y-4 px-5 py-4">
        {links.length > 0 && (
          <ul className="space-y-1 text-sm">
            {links.map((href) => (
              <li key={href}>
                <a href={href} className="prose-link break-all">
                  {href}
                </a>
              </li>
            ))}
          </ul>
        )}
        <pre className="bg-paper-sunken text-ink overflow-x-auto rounded-md px-4 py-3 font-sans text-sm whitespace-pre-wrap">
          {mail.text}
        </pre>
      </div>
    </article>
  );
}
