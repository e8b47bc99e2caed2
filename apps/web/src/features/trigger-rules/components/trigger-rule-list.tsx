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
import { AddRegular, DeleteRegular, EditRegular } from '@fluentui/react-icons';
import { ConfirmDialog, EmptyState, roleLabels, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { TriggerRule } from '@/api/contract';
import { useChangeTriggerRule, useTriggerRules } from '@/features/trigger-rules/api/trigger-rules';
import { LevelBadge } from '@/features/trigger-rules/components/level-badge';
import type { RoundPlaceFormat } from '@/features/trigger-rules/components/trigger-preview';
import { TriggerRuleForm } from '@/features/trigger-rules/components/trigger-rule-form';
import { isApiError } from '@/lib/api-client';

export interface TriggerRuleListProps {
  projectId: string;
  canEdit: boolean;
  /** How rounds' places are written when a rule is tried on recent rounds. */
  placeFormat?: RoundPlaceFormat;
}

const useStyles = makeStyles({
  toolbar: { display: 'flex', gap: tokens.spacingHorizontalM, marginBottom: tokens.spacingVerticalL },
  wrap: { overflowX: 'auto' },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  actions: { display: 'flex', gap: tokens.spacingHorizontalXS },
  action: { maxWidth: '30rem' },
});

type Editing = { kind: 'new' } | { kind: 'edit'; rule: TriggerRule } | null;

/** The project's trigger rules (red first, as the API lists them) with add, change and delete. */
export function TriggerRuleList({ projectId, canEdit, placeFormat }: TriggerRuleListProps) {
  const styles = useStyles();
  const { data: rules } = useTriggerRules(projectId);
  const change = useChangeTriggerRule(projectId);
  const [editing, setEditing] = useState<Editing>(null);
  const [deleting, setDeleting] = useState<TriggerRule | null>(null);
  const [deleteError, setDeleteError] = useState<string | null>(null);

  if (editing !== null) {
    return (
      <TriggerRuleForm
        projectId={projectId}
        rule={editing.kind === 'edit' ? editing.rule : undefined}
        onSaved={() => setEditing(null)}
        onCancel={() => setEditing(null)}
        placeFormat={placeFormat}
      />
    );
  }

  const confirmDelete = async () => {
    if (deleting === null) return;
    setDeleteError(null);
    try {
      await change.mutateAsync({ kind: 'delete', ruleId: deleting.id });
      setDeleting(null);
    } catch (error) {
      setDeleteError(isApiError(error) ? error.message : 'The rule could not be deleted. Try again.');
    }
  };

  return (
    <>
      {canEdit && (
        <div className={styles.toolbar}>
          <Button
            className={styles.button}
            size="large"
            appearance="primary"
            icon={<AddRegular />}
            onClick={() => setEditing({ kind: 'new' })}
          >
            Add trigger rule
          </Button>
        </div>
      )}
      {rules.length === 0 ? (
        <EmptyState
          title="No trigger rules yet"
          message={
            canEdit
              ? 'Add the rules that flag a round: what is watched, when it fires, and what is done about it.'
              : 'An admin or engineer adds the trigger rules here.'
          }
        />
      ) : (
        <div className={styles.wrap}>
          <Table aria-label="Trigger rules">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Level</TableHeaderCell>
                <TableHeaderCell>Rule</TableHeaderCell>
                <TableHeaderCell>Action</TableHeaderCell>
                <TableHeaderCell>Who acts</TableHeaderCell>
                <TableHeaderCell>Within</TableHeaderCell>
                <TableHeaderCell>State</TableHeaderCell>
                {canEdit && <TableHeaderCell>Change</TableHeaderCell>}
              </TableRow>
            </TableHeader>
            <TableBody>
              {rules.map((r) => (
                <TableRow key={r.id} aria-label={r.summary}>
                  <TableCell>
                    <LevelBadge level={r.level} />
                  </TableCell>
                  <TableCell>{r.summary}</TableCell>
                  <TableCell className={styles.action}>{r.action}</TableCell>
                  <TableCell>{roleLabels[r.ownerRole]}</TableCell>
                  <TableCell>{`${r.timeAllowedHours} h`}</TableCell>
                  <TableCell>
                    {r.enabled ? (
                      <Badge appearance="tint" color="brand">
                        On
                      </Badge>
                    ) : (
                      <Badge appearance="outline" color="subtle">
                        Off
                      </Badge>
                    )}
                  </TableCell>
                  {canEdit && (
                    <TableCell>
                      <div className={styles.actions}>
                        <Button
                          className={styles.button}
                          icon={<EditRegular />}
                          aria-label={`Change rule: ${r.summary}`}
                          onClick={() => setEditing({ kind: 'edit', rule: r })}
                        />
                        <Button
                          className={styles.button}
                          icon={<DeleteRegular />}
                          aria-label={`Delete rule: ${r.summary}`}
                          onClick={() => {
                            setDeleteError(null);
                            setDeleting(r);
                          }}
                        />
                      </div>
                    </TableCell>
                  )}
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </div>
      )}
      <ConfirmDialog
        open={deleting !== null}
        title="Delete this trigger rule?"
        confirmLabel="Delete rule"
        busy={change.isPending}
        problem={deleteError}
        onConfirm={() => void confirmDelete()}
        onCancel={() => setDeleting(null)}
      >
        <p>{`“${deleting?.summary ?? ''}” will no longer be checked. To pause it instead, change it and switch it off.`}</p>
      </ConfirmDialog>
    </>
  );
}
