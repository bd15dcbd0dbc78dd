// Asking an outside service whether it answers (the mail server, Stripe, Cloudinary) costs a
// connection, so readiness checks and the worker share one answer for a few seconds, and
// callers arriving while a question is out wait for that same question.

export interface ProbeResult {
  ok: boolean;
  /** How long the question took. */
  latency_ms: number;
  checked_at: string;
  /** Why not, in a few words (an error code or the service's message), when ok is false. */
  error?: string;
}

export const PROBE_CACHE_MS = 5_000;
// The probe's own limit, below any load balancer's usual health-check timeout.
export const PROBE_TIMEOUT_MS = 4_000;

export interface CachedProbe {
  (): Promise<ProbeResult>;
  /** Forget the last answer (a test that just started or stopped the service). */
  reset(): void;
}

/**
 * Why a check failed, in a few words fit for a public answer: the error's code when it has
 * one (ECONNREFUSED, SQLITE_FULL …), not its message, which can name hosts, ports or SQL.
 */
export function failureReason(err: unknown): string {
  const e = err as { code?: unknown; message?: unknown };
  if (typeof e?.code === "string" && e.code) return e.code;
  return String(e?.message ?? err).split("\n")[0].slice(0, 120);
}

export function cachedProbe(ask: () => Promise<unknown>, ttlMs = PROBE_CACHE_MS, timeoutMs = PROBE_TIMEOUT_MS): CachedProbe {
  let last: { at: number; result: ProbeResult } | null = null;
  let inFlight: Promise<ProbeResult> | null = null;
  const run = async (): Promise<ProbeResult> => {
    const started = Date.now();
    let timer: NodeJS.Timeout | undefined;
    try {
      await Promise.race([
        ask(),
        new Promise((_, reject) => {
          timer = setTimeout(() => reject(Object.assign(new Error(`no answer within ${timeoutMs} ms`), { code: "ETIMEDOUT" })), timeoutMs);
        }),
      ]);
      return { ok: true, latency_ms: Date.now() - started, checked_at: new Date().toISOString() };
    } catch (err) {
      return { ok: false, latency_ms: Date.now() - started, checked_at: new Date().toISOString(), error: failureReason(err) };
    } finally {
      clearTimeout(timer);
    }
  };
  const probe = (async () => {
    if (last && Date.now() - last.at < ttlMs) return last.result;
    inFlight ??= run().then((result) => {
      last = { at: Date.now(), result };
      inFlight = null;
      return result;
    });
    return inFlight;
  }) as CachedProbe;
  probe.reset = () => {
    last = null;
  };
  return probe;
}
