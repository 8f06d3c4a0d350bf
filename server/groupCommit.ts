import type { Knex } from 'knex';
import type { Db } from './db';

/** What became of one unit of a group: its result, or an error of its own that wrote nothing. */
export type Outcome<O> = { value: O } | { error: unknown };

/**
 * Applies units in arrival order as one piece of work, each seeing the ones before it as if
 * they had committed on their own. A unit's own refusal (decided before anything is written)
 * comes back as its error; any throw means the whole attempt is undone.
 */
export type ApplyGroup<I, O> = (trx: Knex.Transaction, units: I[]) => Promise<Outcome<O>[]>;

type Waiting<I, O> = { unit: I; resolve: (value: O) => void; reject: (error: unknown) => void };

export type GroupLimits<I> = {
  /** How much room a unit takes in a group (e.g. its mutations); a group holds at most `maxWeight`. */
  weight: (unit: I) => number;
  maxWeight: number;
};

/**
 * Group commit: units that arrive together (or while a commit is under way) are applied in one
 * transaction and committed (one disk flush) as one. Each unit is answered only after that
 * commit. If the group's joint attempt throws, it is undone and each unit is tried alone in a
 * savepoint of its own, so one unit's failure never costs another its answer. A unit that
 * arrives alone waits only for the end of the event loop's turn.
 */
export class GroupCommit<I, O> {
  private readonly waiting: Waiting<I, O>[] = [];
  private draining = false;

  constructor(
    private readonly db: Db,
    private readonly apply: ApplyGroup<I, O>,
    private readonly limits: GroupLimits<I>,
  ) {}

  run(unit: I): Promise<O> {
    return new Promise<O>((resolve, reject) => {
      this.waiting.push({ unit, resolve, reject });
      if (this.draining) return;
      this.draining = true;
      // With a synchronous driver (better-sqlite3) a whole request runs in one turn of the event
      // loop, so the next requests are only read after this one; waiting for the turn's end
      // lets every request that has already arrived join this commit.
      setImmediate(() => void this.drain());
    });
  }

  private async drain(): Promise<void> {
    while (this.waiting.length > 0) await this.commitNext();
    this.draining = false;
  }

  /** The units waiting now, in order, up to the weight limit (always at least one). */
  private nextGroup(): Waiting<I, O>[] {
    let weight = 0;
    let size = 0;
    while (size < this.waiting.length) {
      weight += this.limits.weight(this.waiting[size]!.unit);
      if (size > 0 && weight > this.limits.maxWeight) break;
      size += 1;
    }
    return this.waiting.splice(0, size);
  }

  private async commitNext(): Promise<void> {
    let group: Waiting<I, O>[] = [];
    let outcomes: Outcome<O>[];
    try {
      outcomes = await this.db.transaction(async (trx) => {
        // Taken only once the connection is ours: what arrived while waiting for it joins too.
        group = this.nextGroup();
        const units = group.map((w) => w.unit);
        if (units.length === 1) return this.apply(trx, units);
        try {
          return await trx.transaction((joint) => this.apply(joint, units));
        } catch {
          const alone: Outcome<O>[] = [];
          for (const unit of units) {
            try {
              alone.push(...(await trx.transaction((own) => this.apply(own, [unit]))));
            } catch (error) {
              alone.push({ error });
            }
          }
          return alone;
        }
      });
    } catch (error) {
      // Not committed: nothing of the group was stored (a lone unit's own failure lands here too).
      // If the transaction never began, the units it would have taken are answered with its error.
      for (const w of group.length > 0 ? group : this.nextGroup()) w.reject(error);
      return;
    }
    outcomes.forEach((outcome, i) =>
      'error' in outcome ? group[i]!.reject(outcome.error) : group[i]!.resolve(outcome.value),
    );
  }
}
