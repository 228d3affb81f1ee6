import { cn } from "@/lib/cn";
import type { DevMailMessage } from "@/features/dev-mailbox/api/get-dev-mailbox";
import { formatReceivedAt } from "@/features/dev-mailbox/utils/format-received-at";

interface MessageListProps {
  messages: readonly DevMailMessage[];
  selectedId: number | undefined;
  onSelect: (id: number) => void;
}

/** The received messages, newest first; the subject opens a message. Long lists scroll under a fixed header. */
export function MessageList({ messages, selectedId, onSelect }: MessageListProps) {
  return (
    <div className="max-h-[21rem] overflow-auto">
      <table className="w-full border-collapse text-left text-[0.95rem]" aria-label="Received messages">
        <thead>
          <tr className="sticky top-0 border-b border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
            <th scope="col" className="px-4 py-2 font-semibold">Received</th>
            <th scope="col" className="px-4 py-2 font-semibold">Subject</th>
            <th scope="col" className="px-4 py-2 font-semibold">To</th>
            <th scope="col" className="px-4 py-2 font-semibold">From</th>
          </tr>
        </thead>
        <tbody>
          {messages.map((message) => {
            const isSelected = message.id === selectedId;
            return (
              <tr
                key={message.id}
                className={cn(
                  "border-b border-ink-100 align-top last:border-b-0",
                  isSelected ? "bg-tide-50 shadow-[inset_3px_0_0_var(--color-tide-600)]" : "hover:bg-ink-50",
                )}
              >
                <td className="num px-4 py-2 text-sm whitespace-nowrap text-ink-700">
                  <time dateTime={message.receivedAt}>{formatReceivedAt(message.receivedAt)}</time>
                </td>
                <th scope="row" className="px-4 py-2 font-normal">
                  <button
                    type="button"
                    onClick={() => onSelect(message.id)}
                    aria-current={isSelected ? "true" : undefined}
                    className={cn(
                      "text-left hover:underline",
                      isSelected ? "font-semibold text-ink-950" : "text-tide-700",
                    )}
                  >
                    {message.subject || "(no subject)"}
                  </button>
                </th>
                <td className="px-4 py-2 text-sm [overflow-wrap:anywhere] text-ink-700">{message.to.join(", ")}</td>
                <td className="px-4 py-2 text-sm [overflow-wrap:anywhere] text-ink-700">{message.from}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
