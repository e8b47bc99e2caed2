import {
  Badge,
  Button,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { EditRegular } from '@fluentui/react-icons';
import { formatAzimuth } from '@roundbook/domain';
import { formatChainage, gradientPercentToDegrees } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import type { Heading } from '@/api/contract';
import { trimmed } from '@/features/headings/schemas/heading.schema';
import { profileShapeLabels, stageLabels } from '@/features/headings/utils/labels';

export interface HeadingsTableProps {
  headings: Heading[];
  /** Without it the table is read-only. */
  onEdit?: (heading: Heading) => void;
}

const useStyles = makeStyles({
  wrap: { overflowX: 'auto' },
  row: { minHeight: `${TOUCH_TARGET_PX}px` },
  stages: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  muted: { color: tokens.colorNeutralForeground3 },
});

export function gradientText(percent: number): string {
  return `${percent > 0 ? '+' : ''}${trimmed(percent, 2)} % (${trimmed(gradientPercentToDegrees(percent), 2)}°)`;
}

export function HeadingsTable({ headings, onEdit }: HeadingsTableProps) {
  const styles = useStyles();
  return (
    <div className={styles.wrap}>
      <Table aria-label="Headings" size="medium">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Code</TableHeaderCell>
            <TableHeaderCell>Name</TableHeaderCell>
            <TableHeaderCell>Start</TableHeaderCell>
            <TableHeaderCell>Drive</TableHeaderCell>
            <TableHeaderCell>Gradient</TableHeaderCell>
            <TableHeaderCell>Profile</TableHeaderCell>
            <TableHeaderCell>Stages</TableHeaderCell>
            <TableHeaderCell>Round</TableHeaderCell>
            {onEdit !== undefined && <TableHeaderCell>Change</TableHeaderCell>}
          </TableRow>
        </TableHeader>
        <TableBody>
          {headings.map((h) => (
            <TableRow key={h.id} className={styles.row}>
              <TableCell>
                <strong>{h.code}</strong>
              </TableCell>
              <TableCell>{h.name}</TableCell>
              <TableCell>
                {formatChainage(h.startChainage, { style: h.chainageStyle, decimals: h.chainageDecimals })}
              </TableCell>
              <TableCell>{formatAzimuth(h.driveTrend, 1)}</TableCell>
              <TableCell>{gradientText(h.gradientPercent)}</TableCell>
              <TableCell>
                {`${profileShapeLabels[h.profileShape]} ${trimmed(h.profileWidth, 2)} × ${trimmed(h.profileHeight, 2)} m`}
              </TableCell>
              <TableCell>
                <div className={styles.stages}>
                  {h.stages.map((s) => (
                    <Badge key={s} appearance="tint" color="brand" shape="rounded">
                      {stageLabels[s]}
                    </Badge>
                  ))}
                </div>
              </TableCell>
              <TableCell>{`${trimmed(h.plannedRoundLength, 2)} m`}</TableCell>
              {onEdit !== undefined && (
                <TableCell>
                  <Button
                    className={styles.button}
                    size="large"
                    icon={<EditRegular />}
                    aria-label={`Change heading ${h.code}`}
                    onClick={() => onEdit(h)}
                  >
                    Change
                  </Button>
                </TableCell>
              )}
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </div>
  );
}
