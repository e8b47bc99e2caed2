import {
  Button,
  Field,
  makeStyles,
  Select,
  Spinner,
  Subtitle2,
  Text,
  tokens,
} from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { RoundRevision } from '@/features/review/api/review';
import { useRoundRevisions } from '@/features/review/api/review';
import { revisionDiff } from '@/features/review/utils/revision-diff';

export interface RevisionCompareProps {
  projectId: string;
  roundId: string;
  when: (iso: string) => string;
}

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  control: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '16rem' },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, alignSelf: 'flex-start' },
  table: { borderCollapse: 'collapse', width: '100%', marginTop: tokens.spacingVerticalS },
  cell: {
    textAlign: 'left',
    verticalAlign: 'top',
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalS}`,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    overflowWrap: 'anywhere',
  },
});

const eventWords: Record<RoundRevision['event'], string> = {
  submit: 'submitted',
  confirm: 'confirmed',
  return: 'returned',
  correct: 'corrected',
};

function Compare({ revisions, when }: { revisions: RoundRevision[]; when: (iso: string) => string }) {
  const styles = useStyles();
  const [from, setFrom] = useState(revisions[revisions.length - 2].id);
  const [to, setTo] = useState(revisions[revisions.length - 1].id);
  const a = revisions.find((r) => r.id === from) ?? revisions[0];
  const b = revisions.find((r) => r.id === to) ?? revisions[revisions.length - 1];
  const changes = revisionDiff(a.record, b.record);
  const label = (r: RoundRevision) =>
    `Revision ${r.revision} · ${eventWords[r.event]} · ${when(r.createdAt)}`;
  return (
    <>
      <div className={styles.row}>
        <Field label="From">
          <Select className={styles.control} size="large" value={from} onChange={(_, d) => setFrom(d.value)}>
            {revisions.map((r) => (
              <option key={r.id} value={r.id}>
                {label(r)}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="To">
          <Select className={styles.control} size="large" value={to} onChange={(_, d) => setTo(d.value)}>
            {revisions.map((r) => (
              <option key={r.id} value={r.id}>
                {label(r)}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      {changes.length === 0 ? (
        <Text>No field differs between these two.</Text>
      ) : (
        <table className={styles.table} aria-label="Fields that differ">
          <thead>
            <tr>
              <th className={styles.cell}>Field</th>
              <th className={styles.cell}>{`Revision ${a.revision} (${eventWords[a.event]})`}</th>
              <th className={styles.cell}>{`Revision ${b.revision} (${eventWords[b.event]})`}</th>
            </tr>
          </thead>
          <tbody>
            {changes.map((c) => (
              <tr key={c.field} data-testid="revision-change">
                <td className={styles.cell}>{c.field}</td>
                <td className={styles.cell}>{c.before}</td>
                <td className={styles.cell}>{c.after}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}

/** Every frozen revision stays readable: any two are compared field by field. */
export function RevisionCompare({ projectId, roundId, when }: RevisionCompareProps) {
  const styles = useStyles();
  const [open, setOpen] = useState(false);
  const { data, isPending, error } = useRoundRevisions(projectId, roundId, open);
  return (
    <section aria-label="Revisions">
      <Subtitle2 as="h3">Revisions</Subtitle2>
      {!open ? (
        <Button className={styles.button} size="large" onClick={() => setOpen(true)}>
          Compare revisions
        </Button>
      ) : isPending ? (
        <Spinner label="Reading the revisions…" />
      ) : error ? (
        <Text>{`The revisions could not be read: ${error.message}`}</Text>
      ) : data.length < 2 ? (
        <Text>Only one revision so far: nothing to compare.</Text>
      ) : (
        <Compare revisions={data} when={when} />
      )}
    </section>
  );
}
