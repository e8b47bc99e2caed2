import {
  Badge,
  Button,
  Caption1,
  Field,
  Input,
  makeStyles,
  Select,
  Spinner,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  tokens,
} from '@fluentui/react-components';
import type { BadgeProps } from '@fluentui/react-components';
import { formatQ, triggerLevelText } from '@roundbook/domain';
import { formatChainage, parseChainage } from '@roundbook/geomath';
import { TOUCH_TARGET_PX, TriggerLevelBadge } from '@roundbook/ui';
import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { RoundListFilters } from '@/api/resources/keys';
import { useRounds } from '@/features/rounds/api/get-round';
import type { ChainageStyle, HeadingDetail, RoundStatus, Stage } from '@/features/rounds/api/types';
import { HeadingExports } from '@/features/rounds/components/heading-exports';
import { shiftLabels, stageLabels, statusLabels } from '@/features/rounds/utils/labels';

export interface RoundsTableProps {
  projectId: string;
  heading: HeadingDetail;
  pageSize?: number;
}

const statusColours: Record<RoundStatus, BadgeProps['color']> = {
  draft: 'informative',
  submitted: 'warning',
  confirmed: 'success',
  returned: 'danger',
};

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalM },
  filters: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  select: { minWidth: '10rem', '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  input: { minHeight: `${TOUCH_TARGET_PX}px`, width: '9rem' },
  row: { height: '56px' },
  sortButton: { minHeight: `${TOUCH_TARGET_PX}px`, paddingInline: 0, fontWeight: tokens.fontWeightSemibold },
  link: {
    // The theme's link colour: the browser's default blue read 2.2:1 on the high-contrast theme's black (axe).
    color: tokens.colorBrandForeground1,
    textDecorationThickness: '2px',
    fontWeight: tokens.fontWeightSemibold,
    fontSize: tokens.fontSizeBase400,
    display: 'inline-flex',
    minHeight: `${TOUCH_TARGET_PX}px`,
    alignItems: 'center',
  },
  number: { fontVariantNumeric: 'tabular-nums' },
  pager: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  muted: { color: tokens.colorNeutralForeground2 },
});

type SortKey = 'faceChainage' | 'shiftDate' | 'q' | 'rmr' | 'roundNumber';

const SORTS: readonly RoundListFilters['sort'][] = [
  'faceChainage',
  '-faceChainage',
  'shiftDate',
  '-shiftDate',
  'q',
  '-q',
  'rmr',
  '-rmr',
  'roundNumber',
  '-roundNumber',
];

/** A typed chainage filter: empty is no limit; anything else must read as a chainage (metres or km+m). */
function readChainage(text: string): { value?: number; error?: string } {
  if (text.trim() === '') return {};
  try {
    return { value: parseChainage(text) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : 'Not a chainage.' };
  }
}

/**
 * The filters as the address holds them (`?status=&stage=&from=&to=&sort=&page=`), so a reload or a shared
 * link keeps them (issue 19 item 9). Values that are not valid are left out, never guessed.
 */
function filtersOf(search: URLSearchParams, heading: HeadingDetail, pageSize: number): RoundListFilters {
  const status = search.get('status') as RoundStatus | null;
  const stage = search.get('stage') as Stage | null;
  const sort = search.get('sort') as RoundListFilters['sort'] | null;
  const page = Number(search.get('page'));
  const from = readChainage(search.get('from') ?? '').value;
  const to = readChainage(search.get('to') ?? '').value;
  return {
    page: Number.isInteger(page) && page >= 1 ? page : 1,
    pageSize,
    sort: sort !== null && SORTS.includes(sort) ? sort : '-faceChainage',
    ...(status !== null && status in statusLabels ? { status } : {}),
    ...(stage !== null && heading.stages.includes(stage) ? { stage } : {}),
    ...(from !== undefined ? { fromChainage: from } : {}),
    ...(to !== undefined ? { toChainage: to } : {}),
  };
}

/** The Rounds tab: every round of the heading, paged, sorted and filtered by the server. */
export function RoundsTable({ projectId, heading, pageSize = 25 }: RoundsTableProps) {
  const styles = useStyles();
  const [search, setSearch] = useSearchParams();
  const filters = filtersOf(search, heading, pageSize);
  const [from, setFrom] = useState(search.get('from') ?? '');
  const [to, setTo] = useState(search.get('to') ?? '');
  // A limit is checked when it is applied (leaving the field or Enter), then as it is corrected.
  const [checked, setChecked] = useState(false);
  const fromRead = checked ? readChainage(from) : {};
  const toRead = checked ? readChainage(to) : {};
  const rounds = useRounds(projectId, heading.id, filters);
  const style: { style: ChainageStyle; decimals: number } = {
    style: heading.chainageStyle,
    decimals: heading.chainageDecimals,
  };

  /** Writes the changed filters into the address (replacing the entry: filtering is not navigation). */
  const write = (change: Record<string, string | undefined>) =>
    setSearch(
      (s) => {
        const n = new URLSearchParams(s);
        for (const [k, v] of Object.entries(change)) {
          if (v === undefined || v === '') n.delete(k);
          else n.set(k, v);
        }
        return n;
      },
      { replace: true },
    );
  const update = (change: Partial<RoundListFilters>) => {
    const next: Record<string, string | undefined> = { page: undefined };
    if ('status' in change) next.status = change.status;
    if ('stage' in change) next.stage = change.stage;
    if ('sort' in change) next.sort = change.sort === '-faceChainage' ? undefined : change.sort;
    if (change.page !== undefined) next.page = change.page === 1 ? undefined : String(change.page);
    write(next);
  };
  const sortBy = (key: SortKey) =>
    update({
      sort: filters.sort === key ? `-${key}` : filters.sort === `-${key}` ? key : `-${key}`,
    });
  const sortMark = (key: SortKey) => (filters.sort === key ? ' ▲' : filters.sort === `-${key}` ? ' ▼' : '');
  const ariaSort = (key: SortKey) =>
    filters.sort === key
      ? ('ascending' as const)
      : filters.sort === `-${key}`
        ? ('descending' as const)
        : undefined;
  const header = (key: SortKey, label: string) => (
    <TableHeaderCell aria-sort={ariaSort(key)}>
      <Button className={styles.sortButton} appearance="transparent" size="large" onClick={() => sortBy(key)}>
        {`${label}${sortMark(key)}`}
      </Button>
    </TableHeaderCell>
  );

  /** Applies both limits when each is empty or a chainage; a limit that is not is shown, not ignored. */
  const applyRange = () => {
    setChecked(true);
    if (readChainage(from).error || readChainage(to).error) return;
    write({ page: undefined, from: from.trim(), to: to.trim() });
  };

  const data = rounds.data;
  const pages = data === undefined ? 1 : Math.max(1, Math.ceil(data.total / data.pageSize));

  return (
    <div className={styles.root}>
      <div className={styles.filters}>
        <Field label="Status" size="large">
          <Select
            className={styles.select}
            value={filters.status ?? ''}
            onChange={(_e, d) => update({ status: d.value === '' ? undefined : (d.value as RoundStatus) })}
          >
            <option value="">Any status</option>
            {(Object.keys(statusLabels) as RoundStatus[]).map((s) => (
              <option key={s} value={s}>
                {statusLabels[s]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Stage" size="large">
          <Select
            className={styles.select}
            value={filters.stage ?? ''}
            onChange={(_e, d) => update({ stage: d.value === '' ? undefined : (d.value as Stage) })}
          >
            <option value="">Any stage</option>
            {heading.stages.map((s) => (
              <option key={s} value={s}>
                {stageLabels[s]}
              </option>
            ))}
          </Select>
        </Field>
        <Field
          label="From chainage"
          size="large"
          validationState={fromRead.error ? 'error' : 'none'}
          validationMessage={fromRead.error}
        >
          <Input
            className={styles.input}
            value={from}
            inputMode="decimal"
            size="large"
            onChange={(_e, d) => setFrom(d.value)}
            onBlur={applyRange}
            onKeyDown={(e) => e.key === 'Enter' && applyRange()}
          />
        </Field>
        <Field
          label="To chainage"
          size="large"
          validationState={toRead.error ? 'error' : 'none'}
          validationMessage={toRead.error}
        >
          <Input
            className={styles.input}
            value={to}
            inputMode="decimal"
            size="large"
            onChange={(_e, d) => setTo(d.value)}
            onBlur={applyRange}
            onKeyDown={(e) => e.key === 'Enter' && applyRange()}
          />
        </Field>
        {rounds.isFetching && <Spinner size="small" label="Loading" />}
        <HeadingExports projectId={projectId} heading={heading} />
      </div>

      <Table aria-label={`Rounds of ${heading.code}`} size="medium">
        <TableHeader>
          <TableRow>
            {header('faceChainage', 'Chainage')}
            {header('roundNumber', 'Round')}
            <TableHeaderCell>Stage</TableHeaderCell>
            {header('shiftDate', 'Date / shift')}
            <TableHeaderCell>Mapper</TableHeaderCell>
            {header('q', 'Q')}
            {header('rmr', 'RMR')}
            <TableHeaderCell>Class recommended</TableHeaderCell>
            <TableHeaderCell>Class confirmed</TableHeaderCell>
            <TableHeaderCell>Status</TableHeaderCell>
            <TableHeaderCell>Trigger</TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {data?.items.map((r) => (
            <TableRow key={r.id} className={styles.row} data-testid="round-row">
              <TableCell>
                <Link className={styles.link} to={`/projects/${projectId}/rounds/${r.id}`}>
                  {formatChainage(r.faceChainage, style)}
                </Link>
              </TableCell>
              <TableCell className={styles.number}>{r.roundNumber}</TableCell>
              <TableCell>{stageLabels[r.stage]}</TableCell>
              <TableCell>{`${r.shiftDate} · ${shiftLabels[r.shift]}`}</TableCell>
              <TableCell>{r.mapperName}</TableCell>
              <TableCell className={styles.number}>{r.q === null ? '—' : formatQ(r.q)}</TableCell>
              <TableCell className={styles.number}>{r.rmr === null ? '—' : r.rmr}</TableCell>
              <TableCell>{r.recommendedClassCode ?? '—'}</TableCell>
              <TableCell>
                {r.confirmedClassCode === null
                  ? r.status === 'confirmed'
                    ? '—'
                    : 'not yet'
                  : r.confirmedClassCode === r.recommendedClassCode
                    ? r.confirmedClassCode
                    : `${r.confirmedClassCode} (changed)`}
              </TableCell>
              <TableCell>
                <Badge appearance="tint" size="large" shape="rounded" color={statusColours[r.status]}>
                  {statusLabels[r.status]}
                </Badge>
              </TableCell>
              <TableCell data-testid="round-trigger">
                <TriggerLevelBadge
                  level={r.triggerLevel}
                  noneLabel={triggerLevelText(r.triggerLevel, r.triggersNotEvaluated)}
                />
              </TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
      {data !== undefined && data.items.length === 0 && (
        <Text className={styles.muted}>No rounds match these filters.</Text>
      )}
      {rounds.isError && <Text role="alert">{rounds.error.message}</Text>}

      <div className={styles.pager}>
        <Button
          className={styles.button}
          size="large"
          disabled={filters.page <= 1}
          onClick={() => update({ page: filters.page - 1 })}
        >
          Previous page
        </Button>
        <Caption1>
          {data === undefined
            ? ''
            : `Page ${data.page} of ${pages} · ${data.total} ${data.total === 1 ? 'round' : 'rounds'}`}
        </Caption1>
        <Button
          className={styles.button}
          size="large"
          disabled={filters.page >= pages}
          onClick={() => update({ page: filters.page + 1 })}
        >
          Next page
        </Button>
      </div>
    </div>
  );
}
