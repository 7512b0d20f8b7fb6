/**
 * The engine's front door: one valid {@link Scenario} in, one {@link ComputeResult} out.
 * (Being written: the signature is fixed.)
 */
import type { Scenario } from '../scenario/schema';
import type { ComputeResult } from './types';

export function computeScenario(_scenario: Scenario): ComputeResult {
  throw new Error('computeScenario is being written');
}
