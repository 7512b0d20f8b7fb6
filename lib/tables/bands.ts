/**
 * Age-band tiling: within each group of strata (the same sex and extra values), the age bands
 * must neither overlap, leave a gap nor repeat, and one table uses one sex scheme. Used by the
 * table schema (whole tables) and by the CSV reader (stratum by stratum, with pauses).
 */
import type { Stratum, TableProblemReport } from './schema';

/** The key that groups strata whose age bands must tile: sex plus the extra values. */
export function stratumGroupKey(s: Pick<Stratum, 'sex' | 'extra'>): string {
  if (s.extra === undefined) return s.sex;
  const keys = Object.keys(s.extra);
  if (keys.length > 1) keys.sort();
  // JSON strings cannot be confused with one another, whatever the values hold.
  let key = s.sex;
  for (const k of keys) key += `\u0000${JSON.stringify(k)}:${JSON.stringify(s.extra[k])}`;
  return key;
}

/** Words for a group in messages: "female", "both sexes, region north". */
export function describeGroup(s: Pick<Stratum, 'sex' | 'extra'>): string {
  const parts = [s.sex === 'any' ? 'both sexes' : s.sex];
  for (const [key, value] of Object.entries(s.extra ?? {})) parts.push(`${key} ${value}`);
  return parts.join(', ');
}

/** Names a stratum in messages: "stratum 3" in a table, "row 7" in a CSV file. */
export type StratumLabel = (index: number) => string;

const defaultLabel: StratumLabel = (index) => `stratum ${index + 1}`;

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * The rules on who the strata cover: one sex scheme ("any" throughout, or "female"/"male"
 * throughout) and, within each group of the same sex and extra values, age bands that
 * neither overlap, leave a gap nor repeat. Paths are `[index, field]`.
 */
export function checkStrataLayout(
  strata: readonly Pick<Stratum, 'sex' | 'ageFrom' | 'ageTo' | 'extra'>[],
  report: TableProblemReport,
  label: StratumLabel = defaultLabel,
): void {
  const layout = new StrataLayout(label);
  strata.forEach((s, i) => layout.add(s, i, report));
  for (const _ of layout.checkBands(report)) {
    // run to the end
  }
}

type Placed = Pick<Stratum, 'sex' | 'ageFrom' | 'ageTo' | 'extra'>;

/**
 * {@link checkStrataLayout} in steps, for a reader that meets strata one by one and must be
 * able to pause: `add` each stratum as it is read (the sex scheme is checked at once), then
 * run `checkBands`, which yields after about every `step` strata so the caller can pause.
 */
export class StrataLayout {
  private first: Placed | undefined;
  private firstIndex = 0;
  private readonly groups = new Map<string, { s: Placed; index: number }[]>();

  constructor(private readonly label: StratumLabel = defaultLabel) {}

  add(s: Placed, index: number, report: TableProblemReport): void {
    const label = this.label;
    if (!this.first) {
      this.first = s;
      this.firstIndex = index;
    } else if ((s.sex === 'any') !== (this.first.sex === 'any')) {
      report([index, 'sex'], 'mixed-sex-strata', `${capitalised(label(index))} has sex "${s.sex}" but ${label(this.firstIndex)} has "${this.first.sex}"; a table uses either "any" throughout or "female"/"male" throughout`);
    }
    if (s.ageFrom > s.ageTo) return; // reported by checkStratum
    const key = stratumGroupKey(s);
    const list = this.groups.get(key);
    if (list) list.push({ s, index });
    else this.groups.set(key, [{ s, index }]);
  }

  /** Checks the age bands group by group: sorted by start, each band must begin the year after the furthest-reaching band before it ends. */
  *checkBands(report: TableProblemReport, step = 5000): Generator<void> {
    const label = this.label;
    let done = 0;
    for (const members of this.groups.values()) {
      const sorted = members.length > 1 ? [...members].sort((a, b) => a.s.ageFrom - b.s.ageFrom || a.s.ageTo - b.s.ageTo || a.index - b.index) : members;
      let reach = sorted[0]!;
      for (let k = 1; k < sorted.length; k++) {
        const prev = sorted[k - 1]!;
        const last = reach;
        const cur = sorted[k]!;
        const s = cur.s;
        const who = () => describeGroup(s);
        if (s.ageFrom === prev.s.ageFrom && s.ageTo === prev.s.ageTo) {
          report([cur.index, 'ageFrom'], 'duplicate-stratum', `${capitalised(label(cur.index))} repeats ${label(prev.index)} (${who()}, ages ${s.ageFrom} to ${s.ageTo}); each stratum appears once`);
        } else if (s.ageFrom <= last.s.ageTo) {
          report([cur.index, 'ageFrom'], 'overlapping-age-bands', `${capitalised(label(cur.index))} (${who()}, ages ${s.ageFrom} to ${s.ageTo}) overlaps ${label(last.index)} (ages ${last.s.ageFrom} to ${last.s.ageTo}); both ends of a band are included, so the next band starts at ${last.s.ageTo + 1}`);
        } else if (s.ageFrom > last.s.ageTo + 1) {
          const missing = s.ageFrom - 1 === last.s.ageTo + 1 ? `Age ${last.s.ageTo + 1} is` : `Ages ${last.s.ageTo + 1} to ${s.ageFrom - 1} are`;
          report([cur.index, 'ageFrom'], 'age-band-gap', `${missing} missing for ${who()}: ${label(last.index)} ends at ${last.s.ageTo} and ${label(cur.index)} starts at ${s.ageFrom}`);
        }
        if (s.ageTo > last.s.ageTo) reach = cur;
      }
      done += members.length;
      if (done >= step) {
        done = 0;
        yield;
      }
    }
  }
}
