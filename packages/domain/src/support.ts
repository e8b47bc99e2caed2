/** A support class of the project's library, as the suggestion reads it. */
export interface SupportClassInput {
  id: string;
  code: string;
  qMin: number | null;
  qMax: number | null;
  rmrMin: number | null;
  rmrMax: number | null;
  maxRoundLength: number;
  retired: boolean;
  sortOrder: number;
}

/**
 * Support classes whose ranges fit the ratings: every range a class defines for which the round has a value
 * must contain it (Q [qMin, qMax), RMR89 [rmrMin, rmrMax]), and at least one range must be checked.
 * Retired classes are never suggested. Best ground first (library order).
 */
export function suggestClasses(classes: SupportClassInput[], q: number | null, rmr: number | null): string[] {
  return classes
    .filter((c) => !c.retired)
    .filter((c) => {
      const hasQ = c.qMin !== null || c.qMax !== null;
      const hasRmr = c.rmrMin !== null || c.rmrMax !== null;
      const checks: boolean[] = [];
      if (hasQ && q !== null) checks.push(q >= (c.qMin ?? 0) && q < (c.qMax ?? Infinity));
      if (hasRmr && rmr !== null) checks.push(rmr >= (c.rmrMin ?? 0) && rmr <= (c.rmrMax ?? 100));
      return checks.length > 0 && checks.every(Boolean);
    })
    .sort((a, b) => a.sortOrder - b.sortOrder)
    .map((c) => c.id);
}

const num = (v: number) => String(Number(v.toFixed(3)));

/** A class's Q band exactly as it is applied, [qMin, qMax): "1 ≤ Q < 10", "Q ≥ 10", "Q < 0.01"; null if none. */
export function qBandText(c: Pick<SupportClassInput, 'qMin' | 'qMax'>): string | null {
  if (c.qMin === null && c.qMax === null) return null;
  if (c.qMin === null) return `Q < ${num(c.qMax ?? 0)}`;
  if (c.qMax === null) return `Q ≥ ${num(c.qMin)}`;
  return `${num(c.qMin)} ≤ Q < ${num(c.qMax)}`;
}

/** A class's RMR89 band as it is applied, both ends included: "RMR89 41–60", "RMR89 ≥ 81"; null if none. */
export function rmrBandText(c: Pick<SupportClassInput, 'rmrMin' | 'rmrMax'>): string | null {
  if (c.rmrMin === null && c.rmrMax === null) return null;
  if (c.rmrMin === null) return `RMR89 ≤ ${c.rmrMax}`;
  if (c.rmrMax === null) return `RMR89 ≥ ${c.rmrMin}`;
  return `RMR89 ${c.rmrMin}–${c.rmrMax}`;
}

/** Both bands of a class in one line, as applied: "1 ≤ Q < 10 · RMR89 44–64". */
export function classBandsText(c: SupportClassInput): string {
  return [qBandText(c), rmrBandText(c)].filter((t): t is string => t !== null).join(' · ') || 'no range';
}

/** What the ratings point to, and why: the classes that fit both, each rating's own class, the cautious one. */
export interface SupportSuggestion {
  /** Classes that fit every rating they define a band for (as suggestClasses). */
  fitting: string[];
  /** The first class (best ground first) whose Q band holds the round's Q; null if none or no Q. */
  byQ: string | null;
  /** The first class whose RMR89 band holds the round's RMR89; null if none or no RMR89. */
  byRmr: string | null;
  /** The class to suggest: the first that fits both; otherwise the more cautious of byQ and byRmr. */
  suggested: string | null;
  /** Why, in words a geologist reads (empty when one class fits both and the ratings agree). */
  reason: string;
}

const fmtQ = (q: number) => (q >= 10 ? String(Number(q.toPrecision(3))) : String(Number(q.toPrecision(2))));

/**
 * The support suggestion with its reason (never "none" without saying why). When Q and RMR89 point to
 * different classes, the more cautious one — later in the library's best-ground-first order — is suggested,
 * and the reason names the rating each class follows.
 */
export function explainSuggestion(
  classes: SupportClassInput[],
  q: number | null,
  rmr: number | null,
): SupportSuggestion {
  const active = classes.filter((c) => !c.retired).sort((a, b) => a.sortOrder - b.sortOrder);
  const byId = new Map(active.map((c) => [c.id, c]));
  const fitting = suggestClasses(active, q, rmr);
  const byQ = q === null ? null : (suggestClasses(active, q, null)[0] ?? null);
  const byRmr = rmr === null ? null : (suggestClasses(active, null, rmr)[0] ?? null);
  const code = (id: string | null) => (id === null ? null : (byId.get(id)?.code ?? null));
  const qText = q === null ? null : `Q ${fmtQ(q)}`;
  const rmrText = rmr === null ? null : `RMR89 ${rmr}`;
  if (active.length === 0) {
    return { fitting, byQ, byRmr, suggested: null, reason: 'The project has no active support classes.' };
  }
  if (q === null && rmr === null) {
    return { fitting, byQ, byRmr, suggested: null, reason: 'No rating yet: give the Q or RMR89 inputs.' };
  }
  if (fitting.length > 0) {
    const first = byId.get(fitting[0])!;
    const followed = [qBandText(first) && qText, rmrBandText(first) && rmrText].filter(Boolean).join(' and ');
    return {
      fitting,
      byQ,
      byRmr,
      suggested: fitting[0],
      reason: `${first.code} fits ${followed} (${classBandsText(first)}).`,
    };
  }
  const candidates = [byQ, byRmr].filter((id): id is string => id !== null).map((id) => byId.get(id)!);
  const cautious = candidates.sort((a, b) => b.sortOrder - a.sortOrder)[0] ?? null;
  const parts: string[] = [];
  if (qText !== null)
    parts.push(byQ === null ? `no class has a Q band holding ${qText}` : `${qText} points to ${code(byQ)}`);
  if (rmrText !== null)
    parts.push(
      byRmr === null
        ? `no class has an RMR89 band holding ${rmrText}`
        : `${rmrText} points to ${code(byRmr)}`,
    );
  const why = parts.join(' and ');
  if (cautious === null) {
    return {
      fitting,
      byQ,
      byRmr,
      suggested: null,
      reason: `No class fits: ${why}. Check the library's bands in Setup.`,
    };
  }
  const neither = byQ !== null && byRmr !== null && byQ !== byRmr ? ', and no class holds both' : '';
  return {
    fitting,
    byQ,
    byRmr,
    suggested: cautious.id,
    reason: `${why.charAt(0).toUpperCase()}${why.slice(1)}${neither}: the more cautious ${cautious.code} is suggested.`,
  };
}
