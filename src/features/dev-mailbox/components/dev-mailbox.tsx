import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { DEV_MAILBOX_LIMIT, isNoLocalMailbox, useDevMailbox } from "@/features/dev-mailbox/api/get-dev-mailbox";
import { MessageList } from "@/features/dev-mailbox/components/message-list";
import { MessageView } from "@/features/dev-mailbox/components/message-view";
import { RecipientFilter } from "@/features/dev-mailbox/components/recipient-filter";

interface DevMailboxProps {
  /** Only the messages to this recipient, or every message. */
  to: string | undefined;
  /** The message open under the list (its id as the URL carries it); the newest when unset or no longer listed. */
  selectedId: string | undefined;
  onFilterChange: (to: string | undefined) => void;
  onSelect: (id: number) => void;
}

/** What the local fake SMTP server received: the list, newest first, and the open message under it. */
export function DevMailbox({ to, selectedId, onFilterChange, onSelect }: DevMailboxProps) {
  const mailbox = useDevMailbox({ to, limit: DEV_MAILBOX_LIMIT });

  if (mailbox.isError && isNoLocalMailbox(mailbox.error)) {
    return (
      <div role="status" className="max-w-3xl rounded-md border border-ink-200 border-l-4 border-l-ink-600 bg-surface px-4 py-3 shadow-panel">
        <p className="font-semibold text-ink-900">No local mailbox: this server sends real e-mail.</p>
        <p className="mt-0.5 text-sm text-ink-700">
          An SMTP server is configured, so messages leave this machine and none are kept here. Read them in the
          recipients' own mail programs.
        </p>
      </div>
    );
  }

  const messages = mailbox.data ?? [];
  const selected = messages.find((m) => String(m.id) === selectedId) ?? messages[0];
  const count = `${messages.length} ${messages.length === 1 ? "message" : "messages"}`;
  const subtitle =
    messages.length >= DEV_MAILBOX_LIMIT ? `The latest ${DEV_MAILBOX_LIMIT}` : to ? `${count} to ${to}` : count;

  return (
    <div className="space-y-4">
      <RecipientFilter key={to ?? ""} value={to} onChange={onFilterChange} />
      {mailbox.isPending ? (
        <LoadingBlock label="Loading the mailbox…" />
      ) : mailbox.isError ? (
        <ErrorPanel
          title="The mailbox could not be loaded"
          message={mailbox.error.message}
          code={mailbox.error instanceof ApiError ? mailbox.error.code : undefined}
          onRetry={() => void mailbox.refetch()}
          isRetrying={mailbox.isFetching}
        />
      ) : (
        <div className="space-y-4">
          <Card
            title="Received"
            subtitle={subtitle}
            flush
            actions={
              <Button variant="secondary" size="sm" onClick={() => void mailbox.refetch()} isLoading={mailbox.isFetching}>
                Refresh
              </Button>
            }
          >
            {messages.length === 0 ? (
              <p className="px-4 py-3 text-ink-700">
                {to ? `No message to ${to} has arrived.` : "No message has arrived yet."}
              </p>
            ) : (
              <MessageList messages={messages} selectedId={selected?.id} onSelect={onSelect} />
            )}
          </Card>
          {selected ? <MessageView key={selected.id} message={selected} /> : null}
        </div>
      )}
    </div>
  );
}
