import * as z from 'zod';
import type { UsState } from './us-state';

/** NFPA 70 (National Electrical Code) editions a request can be assessed against. */
export const NEC_EDITIONS = [2017, 2020, 2023] as const;
export type NecEdition = (typeof NEC_EDITIONS)[number];
export const NecEditionSchema = z.union([z.literal(2017), z.literal(2020), z.literal(2023)], {
  error: 'Choose the 2017, 2020 or 2023 edition',
});

/** Used when neither the request nor the state table names an edition. */
export const FALLBACK_NEC_EDITION: NecEdition = 2020;

/**
 * Default adopted edition per state, used to prefill a new request. A setting, not a fact to rely on:
 * adoption dates and local amendments change and many states leave adoption to municipalities.
 * Values are from memory (not confirmed); the agent confirms the edition with the authority having
 * jurisdiction and can change it on the request.
 */
export const DEFAULT_NEC_EDITION_BY_STATE: Partial<Record<UsState, NecEdition>> = {
  CO: 2023,
  MA: 2023,
  MN: 2023,
  OR: 2023,
  WA: 2023,
  TX: 2023,
  OH: 2017,
  PA: 2017,
  NC: 2020,
  NY: 2017,
  IL: 2017,
  VA: 2020,
};

export function defaultNecEdition(state: UsState | null | undefined): NecEdition {
  return (state && DEFAULT_NEC_EDITION_BY_STATE[state]) || FALLBACK_NEC_EDITION;
}
