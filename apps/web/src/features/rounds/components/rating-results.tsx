import { Caption1, makeStyles, Text, tokens } from '@fluentui/react-components';
import type { RatingOutcome } from '@/features/rounds/api/types';

export interface RatingResultProps {
  title: string;
  /** Computed while typing, with geomath. */
  live: RatingOutcome;
  /** As the server computed it on the last save. */
  saved: RatingOutcome;
  format: (value: number) => string;
  testId: string;
  /** Cautions that qualify this value (e.g. RQD estimated from Jv), shown beside it. */
  notes?: readonly string[];
  /** A round that is no longer edited: the value as saved, without the line comparing it with the server. */
  asSaved?: boolean;
}

const useStyles = makeStyles({
  card: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalXS,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThick} solid ${tokens.colorBrandStroke1}`,
    borderRadius: tokens.borderRadiusXLarge,
    backgroundColor: tokens.colorNeutralBackground1,
    minWidth: '15rem',
    flex: '1 1 15rem',
  },
  title: { fontWeight: tokens.fontWeightSemibold, color: tokens.colorNeutralForeground2 },
  value: {
    fontSize: tokens.fontSizeHero800,
    lineHeight: tokens.lineHeightHero800,
    fontWeight: tokens.fontWeightBold,
  },
  label: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold },
  error: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  parts: {
    margin: 0,
    display: 'grid',
    gridTemplateColumns: 'max-content max-content',
    columnGap: tokens.spacingHorizontalL,
    fontVariantNumeric: 'tabular-nums',
    '& dt': { color: tokens.colorNeutralForeground2 },
    '& dd': { margin: 0, fontWeight: tokens.fontWeightSemibold },
  },
  saved: { color: tokens.colorNeutralForeground2 },
  note: {
    fontWeight: tokens.fontWeightSemibold,
    borderLeft: `${tokens.strokeWidthThicker} solid ${tokens.colorPaletteMarigoldBorderActive}`,
    paddingLeft: tokens.spacingHorizontalS,
  },
});

/** What each `parts` key stands for, in Roundbook's words. */
export const PART_LABELS: Record<string, string> = {
  rqdUsed: 'RQD used',
  jnUsed: 'Jn used',
  jrUsed: 'Jr used',
  ja: 'Ja',
  jw: 'Jw',
  srf: 'SRF',
  strength: 'Strength rating',
  rqd: 'RQD rating',
  spacing: 'Spacing rating',
  condition: 'Joint condition rating',
  persistence: '· persistence',
  separation: '· separation',
  roughness: '· roughness',
  infilling: '· infilling',
  weathering: '· weathering',
  groundwater: 'Groundwater rating',
  orientation: 'Orientation adjustment',
  basic: 'Basic RMR89 (A1–A5)',
  dryUnadjusted: 'RMR89 dry, unadjusted',
  rmr89Dry: 'RMR89 dry, unadjusted',
};

const round = (v: number) => String(Math.round(v * 1000) / 1000);

/** One rating: the value, its class, and the inputs it came from. */
export function RatingResult({
  title,
  live,
  saved,
  format,
  testId,
  notes = [],
  asSaved = false,
}: RatingResultProps) {
  const styles = useStyles();
  const parts = Object.entries(live.parts);
  const differs = saved.value !== live.value;
  return (
    <div className={styles.card} data-testid={testId} role="group" aria-label={title}>
      <Text className={styles.title}>{title}</Text>
      {live.value !== null ? (
        <>
          <Text className={styles.value}>{format(live.value)}</Text>
          {live.label !== null && <Text className={styles.label}>{live.label}</Text>}
        </>
      ) : (
        <Text className={live.error ? styles.error : styles.saved}>{live.error ?? 'Not rated yet'}</Text>
      )}
      {live.value !== null &&
        notes.map((n) => (
          <Text key={n} className={styles.note} data-testid={`${testId}-caution`}>
            {n}
          </Text>
        ))}
      {parts.length > 0 && (
        <dl className={styles.parts}>
          {parts.map(([key, value]) => (
            <div key={key} style={{ display: 'contents' }}>
              <dt>{PART_LABELS[key] ?? key}</dt>
              <dd>{round(value)}</dd>
            </div>
          ))}
        </dl>
      )}
      {!asSaved && (
        <Caption1 className={styles.saved}>
          {saved.value === null
            ? 'Not on the server yet.'
            : differs
              ? `Saved on the server: ${format(saved.value)} (updates on the next save).`
              : 'Same as saved on the server.'}
        </Caption1>
      )}
    </div>
  );
}
