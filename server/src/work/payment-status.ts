import type { Db } from '../db/knex';

/**
 * The payment status of a request as the completion letter states it. One small function for the
 * payments feature to answer once it lands; until then the letter says that payment is handled
 * outside Closing Circuit.
 */
export async function paymentStatusOf(_db: Db, _requestId: number): Promise<string> {
  return 'Payment is arranged between the seller and the contractor; not recorded in Closing Circuit.';
}
