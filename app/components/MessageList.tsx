export interface MessageRow {
  id: number;
  to: string;
  subject: string;
  body: string;
  transport: string;
  createdAt: Date | string;
}

// One list for both outbox views; what the body shows (full or masked) is decided on the server.
export function MessageList({ messages, empty }: { messages: MessageRow[]; empty: string }) {
  if (messages.length === 0) return <p className="text-sm text-ink/70">{empty}</p>;
  return (
    <ul className="space-y-3">
      {messages.map((m) => (
        <li key={m.id} className="rounded-lg border border-ink/15 bg-white">
          <details>
            <summary className="flex cursor-pointer flex-wrap gap-x-4 gap-y-1 px-4 py-3 text-sm">
              <span className="font-semibold">{m.subject}</span>
              <span>to {m.to}</span>
              <time dateTime={new Date(m.createdAt).toISOString()} className="text-ink/70">
                {new Date(m.createdAt).toISOString().slice(0, 16).replace("T", " ")} UTC
              </time>
              {m.transport !== "capture" && <span className="text-caution">{m.transport}</span>}
            </summary>
            <pre className="overflow-x-auto whitespace-pre-wrap border-t border-ink/10 px-4 py-3 font-sans text-sm">{m.body}</pre>
          </details>
        </li>
      ))}
    </ul>
  );
}
