// The sweep runner: one per process (inside the app server, or `npm run worker`). It claims
// sweeps from the queue (queue.server.ts), runs each search, keeps the lease alive, and writes
// the outcome. Any number of runners, in any number of processes and machines, may share one
// database: the claim's SKIP LOCKED and the lease token keep them from stepping on each other.
//
// Timing (all from the environment, read at start):
// - SPARWISE_WORKER_CONCURRENCY: sweeps run at once (default max(1, cores − 1)); p-queue holds
//   the limit, and the runner never claims more than it has free slots, so no claimed sweep
//   waits in memory while its lease ticks.
// - SPARWISE_POLL_MS (250): idle poll for new work; an enqueue in this process wakes it at once.
// - SPARWISE_CONTROL_MS (250): how often running sweeps read their row for a cancel request or a
//   lost lease (one query for all of them), so a cancel aborts the search well within a second.
// - SPARWISE_LEASE_MS / SPARWISE_HEARTBEAT_MS: see queueSettings().
// - SPARWISE_SHUTDOWN_GRACE_MS (10000): on stop(), how long running sweeps may take to finish
//   before they are aborted and released back to the queue.
// - SPARWISE_TEST_SWEEP_DELAY_MS: TEST-ONLY hook. Before each search the runner waits this long
//   (abortable, heartbeating as usual), so the crash, stall and restart tests can catch a sweep
//   mid-run without a search so big it would load the shared 2-core machine. Unset in production.
import os from "node:os";
import PQueue from "p-queue";
import type { SearchProblem, SearchResult } from "~/optimizer";
import {
  claimNextSweeps,
  endHeldSweep,
  finishSweep,
  heartbeat,
  queueEvents,
  queueSettings,
  readControl,
  releaseSweep,
  type Claim,
} from "./queue.server";
import { defaultConcurrency, runSweepSearch, type SweepProgress, type SweepSearchOptions } from "./sweep-search.server";
import { sweepTimeBudgetMs } from "./sweep-budget";

export type SearchFn = (problem: SearchProblem, opts: SweepSearchOptions) => Promise<SearchResult>;

export interface RunnerOptions {
  workerId?: string;
  concurrency?: number;
  pollMs?: number;
  controlMs?: number;
  graceMs?: number;
  testDelayMs?: number;
  search?: SearchFn;
  log?: (message: string) => void;
}

type StopReason = "cancel" | "lost" | "shutdown";

const PROGRESS_WRITE_MS = 1_000;

interface Running {
  claim: Claim;
  ac: AbortController;
  progress: SweepProgress | undefined;
  lastBeat: number;
  /** local time of the last heartbeat the database confirmed */
  lastHeld: number;
  /** the progress last sent to the database */
  written?: SweepProgress;
  done: Promise<void>;
}

function intEnv(name: string, fallback: number): number {
  const v = Number(process.env[name]);
  return process.env[name] !== undefined && process.env[name] !== "" && Number.isInteger(v) && v >= 0 ? v : fallback;
}

export { defaultConcurrency };

const sleep = (ms: number, signal?: AbortSignal) =>
  new Promise<void>((resolve, reject) => {
    if (signal?.aborted) return reject(signal.reason);
    const t = setTimeout(() => {
      signal?.removeEventListener("abort", onAbort);
      resolve();
    }, ms);
    const onAbort = () => {
      clearTimeout(t);
      reject(signal!.reason);
    };
    signal?.addEventListener("abort", onAbort, { once: true });
  });

export class SweepRunner {
  readonly workerId: string;
  readonly concurrency: number;
  private readonly pollMs: number;
  private readonly controlMs: number;
  private readonly graceMs: number;
  private readonly testDelayMs: number;
  private readonly search: SearchFn;
  private readonly log: (m: string) => void;
  private readonly pq: PQueue;
  private readonly running = new Map<number, Running>();
  private stopping = false;
  private started = false;
  private wake: (() => void) | null = null;
  /**
   * A wake that came while the loop was not idle (an enqueue committed while a claim's query ran, or
   * a slot freed then): that claim may not have seen the new work, so the next idle() returns at once
   * instead of sleeping a whole poll (the click-to-chart bench caught one such sweep waiting 250 ms).
   */
  private wakePending = false;
  private loopDone: Promise<void> | null = null;
  private controlTimer: NodeJS.Timeout | null = null;
  private controlBusy = false;
  private readonly onEnqueued = () => this.poke();
  private readonly onCancel = (id: number) => this.running.get(id)?.ac.abort("cancel" satisfies StopReason);
  /** sweeps this runner finished, by outcome (for tests, benchmarks and logs) */
  readonly stats = { claimed: 0, succeeded: 0, timedOut: 0, failed: 0, cancelled: 0, lost: 0, released: 0 };

  constructor(opts: RunnerOptions = {}) {
    this.workerId = (opts.workerId ?? `${os.hostname()}:${process.pid}:${Math.random().toString(36).slice(2, 8)}`).slice(0, 100);
    this.concurrency = Math.max(1, opts.concurrency ?? defaultConcurrency());
    this.pollMs = opts.pollMs ?? intEnv("SPARWISE_POLL_MS", 250);
    this.controlMs = Math.max(20, opts.controlMs ?? intEnv("SPARWISE_CONTROL_MS", 250));
    this.graceMs = opts.graceMs ?? intEnv("SPARWISE_SHUTDOWN_GRACE_MS", 10_000);
    this.testDelayMs = opts.testDelayMs ?? intEnv("SPARWISE_TEST_SWEEP_DELAY_MS", 0);
    this.search = opts.search ?? runSweepSearch;
    this.log = opts.log ?? ((m) => console.log(`[sweeps ${this.workerId}] ${m}`));
    this.pq = new PQueue({ concurrency: this.concurrency });
  }

  get active(): number {
    return this.running.size;
  }

  start(): this {
    if (this.started) return this;
    this.started = true;
    queueEvents.on("enqueued", this.onEnqueued);
    queueEvents.on("cancel", this.onCancel);
    this.controlTimer = setInterval(() => void this.control(), this.controlMs);
    this.controlTimer.unref?.();
    this.loopDone = this.loop();
    return this;
  }

  /**
   * Graceful stop: claim nothing more; let running sweeps finish for up to graceMs; then abort the
   * rest and release them to the queue (status queued, lease cleared, the attempt given back), so
   * another worker starts them promptly instead of waiting for the lease to run out.
   */
  async stop(graceMs = this.graceMs): Promise<void> {
    if (!this.started || this.stopping) return this.loopDone ?? undefined;
    this.stopping = true;
    this.wake?.();
    await this.loopDone;
    const all = () => Promise.all([...this.running.values()].map((r) => r.done));
    if (this.running.size > 0) {
      let timer: NodeJS.Timeout | undefined;
      await Promise.race([all(), new Promise<void>((r) => (timer = setTimeout(r, graceMs)))]);
      clearTimeout(timer);
      for (const r of this.running.values()) r.ac.abort("shutdown" satisfies StopReason);
      await all();
    }
    await this.pq.onIdle();
    if (this.controlTimer) clearInterval(this.controlTimer);
    queueEvents.off("enqueued", this.onEnqueued);
    queueEvents.off("cancel", this.onCancel);
  }

  private async loop(): Promise<void> {
    let backoff = 0;
    while (!this.stopping) {
      const free = this.concurrency - this.running.size;
      let claimed = 0;
      if (free > 0) {
        try {
          // this claim sees every enqueue committed before it; a wake from here on may be one it missed
          this.wakePending = false;
          const claims = await claimNextSweeps(this.workerId, free);
          backoff = 0;
          claimed = claims.length;
          for (const c of claims) this.begin(c);
        } catch (e) {
          // The database is down or restarting: keep trying, at most every 2 s.
          backoff = Math.min(2_000, backoff ? backoff * 2 : 100);
          this.log(`claim failed (${e instanceof Error ? e.message : String(e)}); retrying in ${backoff} ms`);
          await this.idle(backoff);
          continue;
        }
      }
      if (this.stopping) break;
      // Took every free slot: there may be more work, look again at once (after the slots free up).
      if (claimed > 0 && claimed === free && this.running.size < this.concurrency) continue;
      await this.idle(this.pollMs);
    }
  }

  /** Wakes the loop: at once when it is idle, else as soon as it would go idle (wakePending). */
  private poke(): void {
    if (this.wake) this.wake();
    else this.wakePending = true;
  }

  private idle(ms: number): Promise<void> {
    if (this.wakePending) {
      this.wakePending = false;
      return Promise.resolve();
    }
    return new Promise((resolve) => {
      // however the wait ends, its wake goes with it: a wake left behind after a timeout would take
      // the next poke while the loop claims, and that poke would be lost
      const done = () => {
        clearTimeout(t);
        if (this.wake === done) this.wake = null;
        resolve();
      };
      const t = setTimeout(done, ms);
      this.wake = done;
    });
  }

  private begin(claim: Claim): void {
    this.stats.claimed++;
    const now = Date.now();
    const r = { claim, ac: new AbortController(), progress: undefined, lastBeat: now, lastHeld: now } as Running;
    r.done = this.pq.add(() => this.execute(r)).then(() => {
      this.running.delete(claim.id);
      this.poke();
    });
    this.running.set(claim.id, r);
  }

  private async execute(r: Running): Promise<void> {
    const { claim, ac } = r;
    const signal = ac.signal;
    let result: SearchResult;
    // The time budget runs from the start of the search (SWEEP_TIME_BUDGET_S, read per sweep).
    const budgetMs = sweepTimeBudgetMs();
    try {
      if (this.testDelayMs > 0) await sleep(this.testDelayMs, signal);
      result = await this.search(claim.problem, {
        signal,
        concurrency: this.concurrency,
        deadline: Date.now() + budgetMs,
        onProgress: (done, total, unit, detail) => (r.progress = { done, total, unit, detail }),
      });
      signal.throwIfAborted();
    } catch (e) {
      if (signal.aborted) return this.stopped(r, signal.reason as StopReason);
      const message = e instanceof Error ? e.message : String(e);
      this.log(`sweep ${claim.id} failed in the search: ${message}`);
      const ok = await this.persist(r, () => endHeldSweep(claim, "failed", `The search stopped with an error: ${message}`));
      if (ok) this.stats.failed++;
      return;
    }
    const ok = await this.persist(r, () => finishSweep(claim, result, budgetMs, r.progress));
    if (ok && result.stoppedEarly) this.stats.timedOut++;
    else if (ok) this.stats.succeeded++;
    else if (ok === false) this.stats.lost++;
  }

  private async stopped(r: Running, reason: StopReason): Promise<void> {
    const { claim } = r;
    if (reason === "cancel") {
      const ok = await this.persist(r, () => endHeldSweep(claim, "cancelled", "Cancelled while running."));
      if (ok) this.stats.cancelled++;
    } else if (reason === "shutdown") {
      const ok = await this.persist(r, () => releaseSweep(claim));
      if (ok) this.stats.released++;
      this.log(`sweep ${claim.id} ${ok ? "released to the queue" : "was no longer ours"}`);
    } else {
      this.stats.lost++;
      this.log(`sweep ${claim.id}: lease lost (another worker has it, or it ended); dropped quietly`);
    }
  }

  /**
   * Runs a final write, retrying while the database is unreachable. Stops retrying once the
   * lease has surely run out (another worker will redo the sweep; our write would be fenced off
   * anyway). Returns the write's answer, or null when it never got through.
   */
  private async persist(r: Running, write: () => Promise<boolean>): Promise<boolean | null> {
    const { leaseMs } = queueSettings();
    for (let delay = 100; ; delay = Math.min(2_000, delay * 2)) {
      try {
        const ok = await write();
        if (!ok) this.log(`sweep ${r.claim.id}: lease lost before the final write; nothing written`);
        return ok;
      } catch (e) {
        this.log(`sweep ${r.claim.id}: final write failed (${e instanceof Error ? e.message : e}); retrying in ${delay} ms`);
        if (Date.now() - r.lastHeld > leaseMs + 30_000) {
          this.log(`sweep ${r.claim.id}: giving up the final write (${e instanceof Error ? e.message : e}); the lease has long expired`);
          return null;
        }
        await sleep(delay);
      }
    }
  }

  /** Every controlMs: one read for cancel requests and lost leases; heartbeats when due. */
  private async control(): Promise<void> {
    if (this.controlBusy || this.running.size === 0) return;
    this.controlBusy = true;
    const { heartbeatMs, leaseMs } = queueSettings();
    try {
      const list = [...this.running.values()].filter((r) => !r.ac.signal.aborted);
      let ctl;
      try {
        ctl = await readControl(list.map((r) => r.claim));
      } catch {
        ctl = null; // database unreachable: the lease may still be ours; heartbeats below decide
      }
      const now = Date.now();
      for (const r of list) {
        const c = ctl?.get(r.claim.id);
        if (c && !c.held) {
          r.ac.abort("lost" satisfies StopReason);
          continue;
        }
        if (c?.cancelRequested) {
          r.ac.abort("cancel" satisfies StopReason);
          continue;
        }
        // Beat when due, and sooner (at most once a second) when the progress moved, so the sweep
        // page's bar follows the search without a write on every control tick.
        const moved = r.progress !== undefined && (r.progress.done !== r.written?.done || r.progress.total !== r.written?.total || r.progress.unit !== r.written?.unit || r.progress.detail?.familiesDone !== r.written?.detail?.familiesDone);
        if (now - r.lastBeat >= heartbeatMs || (moved && now - r.lastBeat >= PROGRESS_WRITE_MS)) {
          r.lastBeat = now;
          r.written = r.progress;
          try {
            if (await heartbeat(r.claim, r.progress)) r.lastHeld = now;
            else r.ac.abort("lost" satisfies StopReason);
          } catch {
            // Could not reach the database. Past the lease another worker may have the sweep:
            // stop the work (every write of ours would be fenced off anyway).
            if (now - r.lastHeld > leaseMs) r.ac.abort("lost" satisfies StopReason);
          }
        }
      }
    } finally {
      this.controlBusy = false;
    }
  }
}
