/**
 * Which formula turns a reported ratio into an exposed-group risk, by measure and study design.
 *
 * | measure | design                                   | the ratio estimates | conversion        |
 * |---------|------------------------------------------|---------------------|-------------------|
 * | RR      | any                                      | risk ratio          | `risk-ratio`      |
 * | HR      | any                                      | hazard ratio        | `rate-ratio`      |
 * | OR      | cohort, trial, cross-sectional,          | risk odds ratio     | `risk-odds-ratio` |
 * |         | case-control (controls from non-cases)   |                     |                   |
 * | OR      | risk-set-case-control (incidence-density | rate ratio          | `rate-ratio`      |
 * |         | sampling, e.g. nested in a cohort)       |                     |                   |
 * | OR      | case-cohort (controls from the whole     | risk ratio          | `risk-ratio`      |
 * |         | cohort at its start)                     |                     |                   |
 * | OR      | matched-case-control (conditional OR,    | risk odds ratio     | `risk-odds-ratio` |
 * |         | controls from non-cases)                 |                     |                   |
 * | OR      | matched-risk-set-case-control            | rate ratio          | `rate-ratio`      |
 * |         | (conditional OR, risk-set sampling)      |                     |                   |
 *
 * Sources: Zhang & Yu 1998, JAMA 280:1690 (risk odds ratio); Greenland & Thomas 1982,
 * Am J Epidemiol 116:547, and Rodrigues & Kirkwood 1990, Int J Epidemiol 19:205 (what the odds
 * ratio of each case-control sampling scheme estimates, without a rare-disease assumption);
 * Knol et al. 2008, Am J Epidemiol 168:1073. A matched study's conditional odds ratio estimates
 * what its control sampling implies, adjusted for the matching factors (Pearce 2016, BMJ
 * 352:i969, from memory).
 */
import type { EffectMeasure, StudyDesign } from '../scenario/schema';
import type { Conversion } from './types';

export function conversionFor(measure: EffectMeasure, design: StudyDesign): Conversion {
  switch (measure) {
    case 'RR':
      return 'risk-ratio';
    case 'HR':
      return 'rate-ratio';
    case 'OR':
      if (design === 'risk-set-case-control' || design === 'matched-risk-set-case-control') return 'rate-ratio';
      if (design === 'case-cohort') return 'risk-ratio';
      return 'risk-odds-ratio';
  }
}
