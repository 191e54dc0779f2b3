import type { DeliveryAttempt, WebhookDelivery } from './payments-state';
import type { PaymentsStore } from './store';
import { retryDelayMs } from './retry-delay';
import { postSignedEvent } from './webhook-post';

/** Settings of the delivery worker. */
export type DeliverySettings = {
  /** Signing secret shared with the receiving endpoint. */
  secret: string;
  /** Delay before the first retry; each further retry doubles it. */
  retryBaseMs: number;
  /** Upper bound of the retry delay. */
  retryCapMs: number;
  /** Time allowed for one attempt. */
  timeoutMs: number;
};

/**
 * Delivers recorded events to the webhook endpoints, one attempt at a time, in creation order.
 *
 * Mirrors the documented behaviour (from memory): any 2xx counts as received; anything else,
 * including timeouts and refused connections, is retried with exponential backoff. Here the
 * delay after the n-th failed attempt is min(cap, base · 2^(n−1)) and retries go on until a 2xx.
 * Every attempt is kept on the delivery record. Pending deliveries live in the persisted state,
 * so they resume after a restart.
 */
export class WebhookDeliveryWorker {
  private timer: NodeJS.Timeout | undefined;
  private queue: Promise<unknown> = Promise.resolve();
  private readonly abort = new AbortController();
  private closed = false;

  constructor(
    private readonly store: PaymentsStore,
    private readonly settings: DeliverySettings,
  ) {}

  /** Schedules a pass over due deliveries (after the current change has been persisted). */
  wake(): void {
    this.scheduleAt(Date.now());
  }

  /** Attempts every undelivered delivery now, ignoring its schedule. */
  deliverPending(): Promise<{ attempted: number; delivered: number }> {
    return this.enqueue(async () => {
      const pending = this.deliveries().filter((delivery) => !delivery.deliveredAt);
      for (const delivery of pending) await this.attempt(delivery);
      this.scheduleNext();
      return {
        attempted: pending.length,
        delivered: pending.filter((d) => this.find(d.id)?.deliveredAt).length,
      };
    });
  }

  /** Delivers one event again to every endpoint now, delivered before or not. */
  replay(eventId: string): Promise<WebhookDelivery[]> {
    return this.enqueue(async () => {
      const deliveries = this.deliveries().filter((delivery) => delivery.eventId === eventId);
      for (const delivery of deliveries) await this.attempt(delivery);
      this.scheduleNext();
      return deliveries.map((delivery) => this.find(delivery.id) ?? delivery);
    });
  }

  /** Stops scheduling, aborts an attempt in flight (left pending, not recorded) and waits. */
  async close(): Promise<void> {
    this.closed = true;
    clearTimeout(this.timer);
    this.abort.abort();
    await this.queue.catch(() => undefined);
  }

  private scheduleAt(when: number): void {
    if (this.closed) return;
    clearTimeout(this.timer);
    this.timer = setTimeout(
      () => void this.enqueue(() => this.runDue()),
      Math.max(0, when - Date.now()),
    );
  }

  private async runDue(): Promise<void> {
    for (const delivery of this.deliveries()) {
      if (this.closed) return;
      if (
        !delivery.deliveredAt &&
        delivery.nextAttemptAt !== null &&
        delivery.nextAttemptAt <= Date.now()
      ) {
        await this.attempt(delivery);
      }
    }
    this.scheduleNext();
  }

  private scheduleNext(): void {
    const next = this.deliveries()
      .map((delivery) => (delivery.deliveredAt ? null : delivery.nextAttemptAt))
      .filter((when): when is number => when !== null);
    if (next.length) this.scheduleAt(Math.min(...next));
  }

  private async attempt(delivery: WebhookDelivery): Promise<void> {
    const event = this.store.state.events[delivery.eventId];
    if (!event || this.closed) return;
    const body = JSON.stringify(event, null, 2);
    const started = Date.now();
    let status: number | null = null;
    let error: string | null = null;
    try {
      status = await postSignedEvent(delivery.url, body, {
        secret: this.settings.secret,
        timeoutMs: this.settings.timeoutMs,
        signal: this.abort.signal,
      });
    } catch (cause) {
      if (this.closed) return; // shutdown, not the endpoint's fault: stays pending for next start
      error = cause instanceof Error ? cause.message : String(cause);
    }
    const record: DeliveryAttempt = {
      at: new Date(started).toISOString(),
      status,
      error,
      durationMs: Date.now() - started,
    };
    this.store.mutate((state) => {
      const current = state.deliveries[delivery.id];
      if (!current) return; // reset while the attempt was in flight
      current.attempts.push(record);
      if (current.deliveredAt) return; // a replay of a delivered event changes nothing else
      if (isSuccess(record)) {
        current.deliveredAt = record.at;
        current.nextAttemptAt = null;
        const stored = state.events[current.eventId];
        if (stored) stored.pending_webhooks = Math.max(0, stored.pending_webhooks - 1);
      } else {
        const failures = current.attempts.filter((attempt) => !isSuccess(attempt)).length;
        current.nextAttemptAt = Date.now() + retryDelayMs(failures, this.settings);
      }
    });
  }

  private enqueue<T>(task: () => Promise<T>): Promise<T> {
    const run = this.queue.then(task);
    this.queue = run.catch((error: unknown) =>
      console.error('[payments stand-in] webhook delivery failed', error),
    );
    return run;
  }

  private deliveries(): WebhookDelivery[] {
    return Object.values(this.store.state.deliveries);
  }

  private find(id: string): WebhookDelivery | undefined {
    return this.store.state.deliveries[id];
  }
}

/** Any 2xx answer counts as received, as the API documents for webhook endpoints. */
function isSuccess(attempt: DeliveryAttempt): boolean {
  return attempt.status !== null && attempt.status >= 200 && attempt.status < 300;
}
