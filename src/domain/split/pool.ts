import { compareScores, scoreOf, type Score } from './evaluate.ts';
import type { Unit } from './tree.ts';

/** The best `capacity` distinct partitions seen so far, best first. */
export class ProposalPool {
  readonly items: { score: Score; sections: Unit[][] }[] = [];
  private keys = new Set<string>();
  constructor(private capacity: number) {}
  /** The score a partition must beat to enter a full pool. */
  worst(): Score | undefined {
    return this.items.length >= this.capacity ? this.items[this.items.length - 1].score : undefined;
  }
  offer(sections: Unit[][]): boolean {
    const score = scoreOf(sections);
    if (this.keys.has(score.key)) return false;
    const w = this.worst();
    if (w && compareScores(score, w) >= 0) return false;
    let i = this.items.length;
    while (i > 0 && compareScores(score, this.items[i - 1].score) < 0) i--;
    this.items.splice(i, 0, { score, sections: sections.map((s) => [...s]) });
    this.keys.add(score.key);
    if (this.items.length > this.capacity) {
      const dropped = this.items.pop();
      if (dropped) this.keys.delete(dropped.score.key);
    }
    return true;
  }
  best(): Score | undefined {
    return this.items[0]?.score;
  }
}
