/**
 * Chart data for "absolute risk in both groups": one bar per group, in per cent, with the
 * exposed group's interval as whisker lengths below and above its bar.
 *
 * No new arithmetic: the risks and limits are the engine's (lib/engine/compute.ts), where the
 * limits come from putting the ratio's limits through the same conversion at a fixed baseline
 * (Cochrane Handbook §12.5.4.5). The reference group has no whisker because the engine holds
 * its risk fixed (its uncertainty is not modelled; the screen says so).
 *
 *   percent = 100 · risk;  whisker below = 100 · (P1 − P1,lower);  whisker above = 100 · (P1,upper − P1)
 */
import type { ComputeResult } from '../engine/types';

export interface AbsoluteRiskBar {
  readonly group: 'reference' | 'exposed';
  /** The risk over the horizon, in per cent. */
  readonly riskPercent: number;
  /** Lower and upper interval limits, in per cent (equal to the risk for the reference group). */
  readonly lowerPercent: number;
  readonly upperPercent: number;
  /** [below, above]: whisker lengths from the bar's top, in percentage points, as the chart's error bar takes them. */
  readonly whiskerPercent: readonly [number, number];
}

/**
 * @example
 * absoluteRiskBars(result) // result: P0 = 0.08, P1 = 0.12 (0.096 to 0.152)
 * //=> [{ group: 'reference', riskPercent: 8, lowerPercent: 8, upperPercent: 8, whiskerPercent: [0, 0] },
 * //    { group: 'exposed', riskPercent: 12, lowerPercent: 9.6, upperPercent: 15.2, whiskerPercent: [2.4, 3.2] }]
 */
export function absoluteRiskBars(result: Pick<ComputeResult, 'referenceRisk' | 'exposedRisk'>): readonly [AbsoluteRiskBar, AbsoluteRiskBar] {
  const p0 = result.referenceRisk * 100;
  const { estimate, lower, upper } = result.exposedRisk;
  const p1 = estimate * 100;
  const p1Lower = lower * 100;
  const p1Upper = upper * 100;
  return [
    { group: 'reference', riskPercent: p0, lowerPercent: p0, upperPercent: p0, whiskerPercent: [0, 0] },
    {
      group: 'exposed',
      riskPercent: p1,
      lowerPercent: p1Lower,
      upperPercent: p1Upper,
      whiskerPercent: [Math.max(0, p1 - p1Lower), Math.max(0, p1Upper - p1)],
    },
  ];
}
