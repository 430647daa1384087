// The capacity in which someone signs for the seller's side (a quote approval): the seller, the
// listing agent for the seller, or an administrator for the seller. Kept with the signature and said
// wherever the signature is shown, so a record never reads as the seller's own when someone else signed.
import * as z from 'zod';
import type { FlowActor } from '../requests/request-flow';

export const SIGNER_CAPACITIES = ['seller', 'listing-agent', 'admin'] as const;
export const SignerCapacitySchema = z.enum(SIGNER_CAPACITIES);
export type SignerCapacity = z.infer<typeof SignerCapacitySchema>;

const CAPACITY_WORDS: Record<SignerCapacity, string> = {
  seller: 'the seller',
  'listing-agent': 'listing agent, for the seller',
  admin: 'administrator, for the seller',
};

/**
 * The capacity of a person signing with `actors` (their parts on the request): the seller when they
 * are the seller (also if they are the listing agent too), else the listing agent, else an administrator.
 */
export function signerCapacityOf(actors: readonly FlowActor[]): SignerCapacity {
  if (actors.includes('seller')) return 'seller';
  if (actors.includes('listing-agent')) return 'listing-agent';
  return 'admin';
}

/** The signer and their capacity: "Ellen Brooks, the seller", "Robert Hale, listing agent, for the seller". */
export function signedInCapacity(signer: string, capacity: SignerCapacity): string {
  return `${signer}, ${CAPACITY_WORDS[capacity]}`;
}
