import {
  Button,
  Card,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  Spinner,
  Text,
  Title3,
  ToggleButton,
  tokens,
} from '@fluentui/react-components';
import {
  SUPPORT_ITEM_STATUSES,
  formatProjectTime,
  formatSupportQuantity,
  supportElementLabels,
  supportElementRules,
  supportItemErrors,
  supportItemStatusLabels,
  supportUnitLabels,
  type SupportItemStatus,
} from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { SupportRecord, SupportRecordItem } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { useSaveSupportRecord, useSupportRecord } from '@/features/support-records/api/support-record';
import { isApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  section: { marginTop: tokens.spacingVerticalXL, display: 'grid', gap: tokens.spacingVerticalM },
  list: { display: 'grid', gap: tokens.spacingVerticalM, margin: 0, padding: 0, listStyle: 'none' },
  item: { display: 'grid', gap: tokens.spacingVerticalS, padding: tokens.spacingHorizontalL },
  head: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'baseline' },
  plan: { color: tokens.colorNeutralForeground2 },
  statuses: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  target: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '8rem' },
  fields: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
  number: { width: '10rem' },
  input: { minHeight: `${TOUCH_TARGET_PX}px` },
  reason: { flexGrow: 1, minWidth: '16rem' },
  meta: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'center' },
});

/** One item as the form holds it: numbers as typed, so a half-typed "2," is kept. */
interface DraftItem {
  element: SupportRecordItem['element'];
  status: SupportItemStatus;
  quantity: string;
  length: string;
  reason: string;
}

const toDraft = (record: SupportRecord): DraftItem[] =>
  record.items.map((i) => ({
    element: i.element,
    status: i.status,
    quantity: i.quantity === null ? '' : String(i.quantity),
    length: i.length === null ? '' : String(i.length),
    reason: i.reason,
  }));

/** A typed number ('' is none; a decimal comma is read as a point); NaN when it is not a number. */
const parsed = (text: string): number | null => {
  const t = text.trim().replace(',', '.');
  return t === '' ? null : /^-?\d+(\.\d+)?$/.test(t) ? Number(t) : Number.NaN;
};

function plannedText(item: SupportRecordItem, classCode: string | null): string {
  if (!item.planned.inClass) return `Not named by class ${classCode ?? ''}`.trim();
  const parts = [item.planned.text];
  if (item.planned.length !== null && !item.planned.text.includes(`${item.planned.length} m`))
    parts.push(`${item.planned.length} m long`);
  return `Planned (class ${classCode ?? ''}): ${parts.filter(Boolean).join(', ') || 'as the class says'}`;
}

export interface SupportRecordSectionProps {
  projectId: string;
  roundId: string;
  /** Supervisors, engineers and admins record; everyone else reads. */
  canRecord: boolean;
  timeZone: string;
}

/** Support as built on a confirmed round: the class's plan against what the crew installed, item by item. */
export function SupportRecordSection({ projectId, roundId, canRecord, timeZone }: SupportRecordSectionProps) {
  const styles = useStyles();
  const queryClient = useQueryClient();
  const { data: record, isPending, error } = useSupportRecord(projectId, roundId);
  const save = useSaveSupportRecord(projectId, roundId);
  const [draft, setDraft] = useState<DraftItem[] | null>(record ? toDraft(record) : null);
  const [source, setSource] = useState(record);
  const [typed, setTyped] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [stale, setStale] = useState<SupportRecord | null>(null);
  const [savedAt, setSavedAt] = useState<number | null>(null);

  // A new version from the server (first load, a save, their version after a conflict) resets the form
  // (adjusted while rendering, not in an effect).
  if (record && record !== source) {
    setSource(record);
    setDraft(toDraft(record));
  }

  if (isPending)
    return (
      <section className={styles.section} aria-label="Support as built">
        <Spinner label="Reading the support record…" />
      </section>
    );
  if (error)
    return (
      <MessageBar intent="error" layout="multiline">
        <MessageBarBody>{`The support record could not be read: ${error.message}`}</MessageBarBody>
      </MessageBar>
    );
  if (!record.confirmed || draft === null) return null;

  const change = (index: number, patch: Partial<DraftItem>) => {
    setDraft((d) => (d ? d.map((x, i) => (i === index ? { ...x, ...patch } : x)) : d));
    setSavedAt(null);
  };

  const submit = async () => {
    setProblem(null);
    setStale(null);
    const local: Record<string, string> = {};
    const items = draft.map((d, index) => {
      const quantity = parsed(d.quantity);
      const length = parsed(d.length);
      const label = supportElementLabels[d.element];
      if (Number.isNaN(quantity))
        local[`items.${index}.quantity`] = `${label}: give the quantity as a number.`;
      if (Number.isNaN(length)) local[`items.${index}.length`] = `${label}: give the length in metres.`;
      const item = { element: d.element, status: d.status, quantity, length, reason: d.reason.trim() };
      if (!Number.isNaN(quantity) && !Number.isNaN(length))
        for (const [k, m] of Object.entries(supportItemErrors(item))) local[`items.${index}.${k}`] = m;
      return item;
    });
    setTyped(local);
    if (Object.keys(local).length) return;
    try {
      await save.mutateAsync({ version: record.version, items });
      setSavedAt(Date.now());
    } catch (e) {
      if (isApiError(e) && e.code === 'STALE_VERSION' && e.details?.current)
        setStale(e.details.current as SupportRecord);
      setProblem(
        isApiError(e)
          ? { message: e.message, fields: e.fields ?? {} }
          : { message: 'Something unexpected went wrong. Try again.', fields: {} },
      );
    }
  };

  const takeTheirs = () => {
    if (!stale) return;
    queryClient.setQueryData(resourceKeys.roundSupportRecord(projectId, roundId), stale);
    setStale(null);
    setProblem(null);
  };

  const fieldMessage = (index: number, key: string) =>
    typed[`items.${index}.${key}`] ?? problem?.fields[`items.${index}.${key}`];
  const outstanding = draft.filter((d) => d.status === 'outstanding').length;

  return (
    <section className={styles.section} aria-labelledby="support-record-title">
      <Title3 id="support-record-title" as="h2">
        Support as built
      </Title3>
      <Text>
        {`Class ${record.classCode ?? '—'}${record.className ? ` · ${record.className}` : ''}. `}
        {record.recorded
          ? `Last recorded by ${record.updatedByName ?? 'someone'}${record.updatedAt ? `, ${formatProjectTime(record.updatedAt, timeZone)}` : ''}.`
          : 'Nothing recorded yet: the list below is the class’s plan.'}
      </Text>
      <Text weight="semibold" data-testid="support-outstanding">
        {outstanding === 0 ? 'Nothing outstanding.' : `${outstanding} outstanding`}
      </Text>
      <ul className={styles.list}>
        {draft.map((d, index) => {
          const server = record.items[index];
          const rule = supportElementRules[d.element];
          const label = supportElementLabels[d.element];
          const unit = supportUnitLabels[rule.unit];
          return (
            <li key={d.element}>
              <Card className={styles.item} role="group" aria-label={label}>
                <div className={styles.head}>
                  <Text weight="semibold" size={500}>
                    {label}
                  </Text>
                  <Text className={styles.plan}>{plannedText(server, record.classCode)}</Text>
                </div>
                {canRecord ? (
                  <>
                    <div className={styles.statuses} role="group" aria-label={`${label}: state`}>
                      {SUPPORT_ITEM_STATUSES.map((s) => (
                        <ToggleButton
                          key={s}
                          size="large"
                          className={styles.target}
                          checked={d.status === s}
                          appearance={d.status === s ? 'primary' : 'secondary'}
                          onClick={() => change(index, { status: s })}
                        >
                          {supportItemStatusLabels[s]}
                        </ToggleButton>
                      ))}
                    </div>
                    <div className={styles.fields}>
                      <Field
                        className={styles.number}
                        label={`${rule.quantityLabel} (${unit})`}
                        size="large"
                        validationMessage={fieldMessage(index, 'quantity')}
                      >
                        <Input
                          className={styles.input}
                          inputMode={rule.unit === 'count' ? 'numeric' : 'decimal'}
                          value={d.quantity}
                          onChange={(_, v) => change(index, { quantity: v.value })}
                        />
                      </Field>
                      {rule.hasLength && (
                        <Field
                          className={styles.number}
                          label="Length (m)"
                          size="large"
                          validationMessage={fieldMessage(index, 'length')}
                        >
                          <Input
                            className={styles.input}
                            inputMode="decimal"
                            value={d.length}
                            onChange={(_, v) => change(index, { length: v.value })}
                          />
                        </Field>
                      )}
                      <Field
                        className={styles.reason}
                        label={d.status === 'not-needed' ? 'Why not needed' : 'Note'}
                        required={d.status === 'not-needed'}
                        size="large"
                        validationMessage={fieldMessage(index, 'reason')}
                      >
                        <Input
                          className={styles.input}
                          value={d.reason}
                          onChange={(_, v) => change(index, { reason: v.value })}
                        />
                      </Field>
                    </div>
                  </>
                ) : (
                  <Text>
                    {`${supportItemStatusLabels[server.status]} · ${formatSupportQuantity(server.element, server.quantity, server.length)}${server.reason ? ` · ${server.reason}` : ''}`}
                  </Text>
                )}
                {server.installedAt && (
                  <Text size={200} className={styles.meta}>
                    {`Recorded by ${server.installedByName ?? 'someone'}, ${formatProjectTime(server.installedAt, timeZone)}`}
                  </Text>
                )}
              </Card>
            </li>
          );
        })}
      </ul>
      {problem && (
        <MessageBar intent="error" layout="multiline" data-testid="support-problem">
          <MessageBarBody>{problem.message}</MessageBarBody>
          {stale && (
            <MessageBarActions>
              <Button className={styles.target} onClick={takeTheirs}>
                Show their version
              </Button>
            </MessageBarActions>
          )}
        </MessageBar>
      )}
      {canRecord && (
        <div className={styles.actions}>
          <Button
            appearance="primary"
            size="large"
            className={styles.target}
            disabled={save.isPending}
            onClick={() => void submit()}
          >
            {save.isPending ? 'Saving…' : 'Save support record'}
          </Button>
          {savedAt !== null && <Text role="status">Saved.</Text>}
        </div>
      )}
    </section>
  );
}
