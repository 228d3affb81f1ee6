import { useMemo, type ReactNode } from "react";
import { Card } from "@/components/ui/card";
import type { DevMailMessage } from "@/features/dev-mailbox/api/get-dev-mailbox";
import { formatReceivedAt } from "@/features/dev-mailbox/utils/format-received-at";
import { isolatedHtml, messageLinks } from "@/features/dev-mailbox/utils/message-content";

function Part({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="space-y-1.5" aria-label={title}>
      <h3 className="text-xs font-semibold tracking-wide text-ink-600 uppercase">{title}</h3>
      {children}
    </section>
  );
}

/**
 * One message: its envelope, the links it carries (openable from here, since a click inside the sandboxed
 * frame goes nowhere useful), the HTML part as a mail program would draw it, and the plain-text part beside it.
 */
export function MessageView({ message }: { message: DevMailMessage }) {
  const links = useMemo(() => messageLinks(message), [message]);
  const srcDoc = useMemo(() => (message.html ? isolatedHtml(message.html) : null), [message.html]);
  const subject = message.subject || "(no subject)";

  return (
    <Card title={subject} aria-label={`Message: ${subject}`}>
      <div className="space-y-4">
        <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-0.5 text-sm">
          <dt className="text-ink-600">From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt className="text-ink-600">To</dt>
          <dd className="break-all">{message.to.join(", ")}</dd>
          <dt className="text-ink-600">Received</dt>
          <dd className="num">
            <time dateTime={message.receivedAt} title={message.receivedAt}>
              {formatReceivedAt(message.receivedAt)}
            </time>
          </dd>
          <dt className="text-ink-600">Size</dt>
          <dd className="num">{(message.sizeBytes / 1024).toFixed(1)} KiB</dd>
        </dl>

        <Part title="Links in this message">
          {links.length === 0 ? (
            <p className="text-sm text-ink-600">No links.</p>
          ) : (
            <ul className="space-y-1 text-sm">
              {links.map((href) => (
                <li key={href} className="break-all">
                  <a href={href} target="_blank" rel="noopener noreferrer" className="text-tide-700 underline hover:text-tide-600">
                    {href}
                  </a>
                </li>
              ))}
            </ul>
          )}
        </Part>

        <div className="grid gap-4 xl:grid-cols-2">
          <Part title="HTML part">
            {srcDoc ? (
              <iframe
                // Empty sandbox: no scripts, forms, pop-ups or same-origin access; the policy inside fetches nothing.
                sandbox=""
                srcDoc={srcDoc}
                title={`HTML part of “${subject}”`}
                referrerPolicy="no-referrer"
                className="block h-[30rem] w-full rounded-md border border-ink-200 bg-white"
              />
            ) : (
              <p className="text-sm text-ink-600">This message has no HTML part.</p>
            )}
          </Part>

          <Part title="Plain-text part">
            {message.text ? (
              <pre className="h-[30rem] overflow-auto rounded-md border border-ink-200 bg-ink-50 px-3 py-2 font-mono text-[0.8rem] leading-relaxed break-words whitespace-pre-wrap text-ink-900">
                {message.text}
              </pre>
            ) : (
              <p className="text-sm text-ink-600">This message has no plain-text part.</p>
            )}
          </Part>
        </div>
      </div>
    </Card>
  );
}
