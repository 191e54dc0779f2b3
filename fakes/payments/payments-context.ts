import type { PaymentsStore } from './store';

/** What every route of the payments stand-in needs; built once by startPaymentsStandIn. */
export type PaymentsContext = {
  readonly store: PaymentsStore;
  /** The one secret key requests must present (Bearer, or Basic with the key as user name). */
  readonly secretKey: string;
  /** Webhook endpoints every event is delivered to; may be empty. */
  readonly webhookUrls: readonly string[];
  /** Origin of the stand-in itself, e.g. 'http://127.0.0.1:12111'; set once listening. */
  baseUrl: string;
  /** Tells the delivery worker that new deliveries are waiting. */
  readonly wakeDelivery: () => void;
};
