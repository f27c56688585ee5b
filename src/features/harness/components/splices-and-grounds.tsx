import {
  GROUND_LOCATION_LABELS,
  type GroundPoint,
  type Splice,
  type Wire,
} from '#shared/schemas/harness.schema.ts';

/** How many wire ends are fastened to each splice and ground point, keyed "kind:id". */
function endCounts(wires: readonly Wire[]) {
  const counts = new Map<string, number>();
  for (const w of wires) {
    for (const e of w.ends) {
      if (e.kind !== 'splice' && e.kind !== 'ground') continue;
      const key = `${e.kind}:${e.refId}`;
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
  }
  return counts;
}

const TH = 'px-2 py-1 text-left font-medium text-ink-soft';
const TD = 'px-2 py-1 align-top';

/** The conversion's splices and ground points, with how many wires each joins. */
export function SplicesAndGrounds({
  wires,
  splices,
  groundPoints,
}: {
  wires: readonly Wire[];
  splices: readonly Splice[];
  groundPoints: readonly GroundPoint[];
}) {
  const counts = endCounts(wires);
  return (
    <details className="rounded-lg border border-rule bg-paper-raised px-4 py-2">
      <summary className="cursor-pointer text-sm font-semibold">
        Splices ({splices.length}) and ground points ({groundPoints.length})
      </summary>
      <div className="mt-2 grid gap-4 lg:grid-cols-2">
        <table aria-label="Splices" className="self-start text-sm">
          <thead>
            <tr className="border-b border-rule">
              <th className={TH}>Splice</th>
              <th className={TH}>Wires</th>
              <th className={TH}>Sealed</th>
              <th className={TH}>Where</th>
            </tr>
          </thead>
          <tbody>
            {splices.map((s) => (
              <tr key={s.id} className="border-b border-rule/60 last:border-0">
                <td className={`${TD} font-mono font-medium`}>{s.label}</td>
                <td className={TD}>{counts.get(`splice:${s.id}`) ?? 0}</td>
                <td className={TD}>{s.sealed ? 'sealed' : 'not sealed'}</td>
                <td className={TD}>
                  {[s.branch, s.distanceMm !== null ? `${s.distanceMm} mm from the datum` : '']
                    .filter(Boolean)
                    .join(', ') || '—'}
                  {s.notes ? <div className="text-xs text-ink-soft">{s.notes}</div> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <table aria-label="Ground points" className="self-start text-sm">
          <thead>
            <tr className="border-b border-rule">
              <th className={TH}>Ground</th>
              <th className={TH}>Wires</th>
              <th className={TH}>Location</th>
              <th className={TH}>Strap</th>
            </tr>
          </thead>
          <tbody>
            {groundPoints.map((g) => (
              <tr key={g.id} className="border-b border-rule/60 last:border-0">
                <td className={`${TD} font-mono font-medium`}>{g.label}</td>
                <td className={TD}>{counts.get(`ground:${g.id}`) ?? 0}</td>
                <td className={TD}>
                  {GROUND_LOCATION_LABELS[g.location]}
                  {g.notes ? <div className="text-xs text-ink-soft">{g.notes}</div> : null}
                </td>
                <td className={TD}>{g.strapSizeMm2 !== null ? `${g.strapSizeMm2} mm²` : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
