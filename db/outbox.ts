// Usage: npm run outbox [-- [--to ADDRESS] [--limit N] [ID]]
// Prints e-mails from the outbox in full, links and all, for the person running the server (like a
// local mail catcher). The web pages never show one person's tokens to another: the recipient reads
// their own under /messages, admins see the team's with tokens masked.
import { closeDb } from "~/lib/db.server";
import { formatMessage, readOutbox, type OutboxQuery } from "~/lib/outbox.server";

function parseArgs(argv: string[]): OutboxQuery {
  const q: OutboxQuery = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    const value = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${a} needs a value`);
      return v;
    };
    if (a === "--to") q.to = value();
    else if (a === "--limit") q.limit = Number(value());
    else if (/^\d+$/.test(a)) q.id = Number(a);
    else if (a === "--help" || a === "-h") {
      console.log("npm run outbox [-- [--to ADDRESS] [--limit N] [ID]]   (the newest 10 by default)");
      process.exit(0);
    } else throw new Error(`unknown argument ${a}; try --help`);
  }
  if (q.limit !== undefined && !(Number.isInteger(q.limit) && q.limit > 0)) throw new Error("--limit must be a whole number above 0");
  return q;
}

try {
  const messages = await readOutbox(parseArgs(process.argv.slice(2)));
  if (messages.length === 0) console.log("The outbox has no such message.");
  for (const m of messages) console.log(formatMessage(m) + "-".repeat(72));
} catch (error) {
  console.error(`outbox: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
