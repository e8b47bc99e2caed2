import {
  Badge,
  Button,
  makeStyles,
  Menu,
  MenuItem,
  MenuList,
  MenuPopover,
  MenuTrigger,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  tokens,
} from '@fluentui/react-components';
import {
  AddRegular,
  ArrowDownRegular,
  ArrowUpRegular,
  ArchiveRegular,
  ArrowUndoRegular,
  DeleteRegular,
  EditRegular,
  MoreHorizontalRegular,
} from '@fluentui/react-icons';
import { ConfirmDialog, EmptyState, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { SupportClass } from '@/api/contract';
import { useChangeSupportClasses, useSupportClasses } from '@/features/support-classes/api/support-classes';
import { RangeWarnings } from '@/features/support-classes/components/range-warnings';
import { SupportClassForm } from '@/features/support-classes/components/support-class-form';
import { qRangeText, rmrRangeText, supportText } from '@/features/support-classes/utils/format';
import { isApiError } from '@/lib/api-client';

export interface SupportClassLibraryProps {
  projectId: string;
  canEdit: boolean;
}

const useStyles = makeStyles({
  toolbar: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalM,
    marginBottom: tokens.spacingVerticalL,
  },
  wrap: { overflowX: 'auto' },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  // Targets of 48 px with 8 px between them, so a gloved tap does not hit the neighbour.
  actions: { display: 'flex', flexWrap: 'nowrap', gap: tokens.spacingHorizontalS },
  // Fluent tables lay out with fixed column widths: the narrow columns get theirs, the text columns
  // share the rest, and the actions column holds its four 48 px buttons on one line.
  numberCol: { width: '3rem' },
  qCol: { width: '9rem' },
  rmrCol: { width: '6rem' },
  roundCol: { width: '6.5rem' },
  actionsCol: {
    width: `calc(4 * ${TOUCH_TARGET_PX}px + 3 * ${tokens.spacingHorizontalXS} + 2 * ${tokens.spacingHorizontalS})`,
  },
  actionsCell: { whiteSpace: 'nowrap' },
  menuItem: { minHeight: `${TOUCH_TARGET_PX}px`, alignItems: 'center' },
  retired: { color: tokens.colorNeutralForeground3 },
  support: { maxWidth: '28rem' },
  problem: { marginBottom: tokens.spacingVerticalM },
});

type Editing = { kind: 'new' } | { kind: 'edit'; supportClass: SupportClass } | null;

function deleteProblem(error: unknown): string {
  if (isApiError(error) && error.status === 409) {
    return `${error.message} A class that rounds refer to stays in the library: retire it instead, so it is no longer offered.`;
  }
  return isApiError(error) ? error.message : 'The class could not be deleted. Try again.';
}

/** The project's support classes, best ground first: order, ranges, support; add, change, retire, delete. */
export function SupportClassLibrary({ projectId, canEdit }: SupportClassLibraryProps) {
  const styles = useStyles();
  const { data: library } = useSupportClasses(projectId);
  const change = useChangeSupportClasses(projectId);
  const [editing, setEditing] = useState<Editing>(null);
  const [deleting, setDeleting] = useState<SupportClass | null>(null);
  const [deleteError, setDeleteError] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [moved, setMoved] = useState<{ text: string; before: string[] } | null>(null);
  const classes = library.classes;

  if (editing !== null) {
    return (
      <SupportClassForm
        projectId={projectId}
        supportClass={editing.kind === 'edit' ? editing.supportClass : undefined}
        onSaved={() => setEditing(null)}
        onCancel={() => setEditing(null)}
      />
    );
  }

  const act = async (run: () => Promise<unknown>) => {
    setProblem(null);
    try {
      await run();
    } catch (error) {
      setProblem(isApiError(error) ? error.message : 'That did not work. Try again.');
    }
  };

  // A move changes the "best ground first" order the suggestions read: it is said, with Undo, at once.
  const move = (index: number, by: -1 | 1) => {
    const before = classes.map((c) => c.id);
    const ids = [...before];
    const [id] = ids.splice(index, 1);
    ids.splice(index + by, 0, id);
    const code = classes[index].code;
    void act(async () => {
      await change.mutateAsync({ kind: 'reorder', ids });
      setMoved({
        text: `${code} moved ${by < 0 ? 'up' : 'down'}, to place ${index + by + 1} of ${ids.length}.`,
        before,
      });
    });
  };
  const undoMove = () => {
    if (moved === null) return;
    const ids = moved.before;
    setMoved(null);
    void act(() => change.mutateAsync({ kind: 'reorder', ids }));
  };

  const setRetired = (c: SupportClass, retired: boolean) =>
    void act(() =>
      change.mutateAsync({ kind: 'update', classId: c.id, body: { retired, version: c.version } }),
    );

  const confirmDelete = async () => {
    if (deleting === null) return;
    setDeleteError(null);
    try {
      await change.mutateAsync({ kind: 'delete', classId: deleting.id });
      setDeleting(null);
    } catch (error) {
      setDeleteError(deleteProblem(error));
    }
  };

  return (
    <>
      <RangeWarnings warnings={library.warnings} />
      {moved !== null && (
        <MessageBar intent="info" data-testid="class-moved" role="status">
          <MessageBarBody>{`${moved.text} The suggestions read the classes in this order.`}</MessageBarBody>
          <MessageBarActions>
            <Button
              className={styles.button}
              icon={<ArrowUndoRegular />}
              disabled={change.isPending}
              onClick={undoMove}
            >
              Undo
            </Button>
            <Button className={styles.button} onClick={() => setMoved(null)}>
              OK
            </Button>
          </MessageBarActions>
        </MessageBar>
      )}
      {canEdit && (
        <div className={styles.toolbar}>
          <Button
            className={styles.button}
            size="large"
            appearance="primary"
            icon={<AddRegular />}
            onClick={() => setEditing({ kind: 'new' })}
          >
            Add support class
          </Button>
        </div>
      )}
      {problem !== null && (
        <div role="alert" className={styles.problem}>
          <MessageBar intent="error" layout="multiline">
            <MessageBarBody>{problem}</MessageBarBody>
          </MessageBar>
        </div>
      )}
      {classes.length === 0 ? (
        <EmptyState
          title="No support classes yet"
          message={
            canEdit
              ? 'Add the design support classes, best ground first. Rounds will be judged against them.'
              : 'A project admin adds the design support classes here.'
          }
        />
      ) : (
        <div className={styles.wrap}>
          <Table aria-label="Support classes, best ground first">
            <TableHeader>
              <TableRow>
                <TableHeaderCell className={styles.numberCol}>#</TableHeaderCell>
                <TableHeaderCell>Class</TableHeaderCell>
                <TableHeaderCell className={styles.qCol}>Q</TableHeaderCell>
                <TableHeaderCell className={styles.rmrCol}>RMR89</TableHeaderCell>
                <TableHeaderCell className={styles.roundCol}>Max round</TableHeaderCell>
                <TableHeaderCell>Support</TableHeaderCell>
                {canEdit && <TableHeaderCell className={styles.actionsCol}>Change</TableHeaderCell>}
              </TableRow>
            </TableHeader>
            <TableBody>
              {classes.map((c, index) => (
                <TableRow
                  key={c.id}
                  className={c.retired ? styles.retired : undefined}
                  aria-label={`${c.code} ${c.name}`}
                >
                  <TableCell>{index + 1}</TableCell>
                  <TableCell>
                    <Text weight="semibold">{c.code}</Text> {c.name}{' '}
                    {c.retired && (
                      <Badge appearance="outline" color="subtle">
                        Retired
                      </Badge>
                    )}
                  </TableCell>
                  <TableCell>{qRangeText(c)}</TableCell>
                  <TableCell>{rmrRangeText(c)}</TableCell>
                  <TableCell>{`${c.maxRoundLength} m`}</TableCell>
                  <TableCell className={styles.support}>{supportText(c)}</TableCell>
                  {canEdit && (
                    <TableCell className={styles.actionsCell}>
                      <div className={styles.actions}>
                        <Button
                          className={styles.button}
                          icon={<ArrowUpRegular />}
                          aria-label={`Move ${c.code} up`}
                          disabled={index === 0 || change.isPending}
                          onClick={() => move(index, -1)}
                        />
                        <Button
                          className={styles.button}
                          icon={<ArrowDownRegular />}
                          aria-label={`Move ${c.code} down`}
                          disabled={index === classes.length - 1 || change.isPending}
                          onClick={() => move(index, 1)}
                        />
                        <Button
                          className={styles.button}
                          icon={<EditRegular />}
                          aria-label={`Change ${c.code}`}
                          onClick={() => setEditing({ kind: 'edit', supportClass: c })}
                        />
                        <Menu positioning="below-end">
                          <MenuTrigger disableButtonEnhancement>
                            <Button
                              className={styles.button}
                              icon={<MoreHorizontalRegular />}
                              aria-label={`More for ${c.code}`}
                            />
                          </MenuTrigger>
                          <MenuPopover>
                            <MenuList>
                              {c.retired ? (
                                <MenuItem
                                  className={styles.menuItem}
                                  icon={<ArrowUndoRegular />}
                                  disabled={change.isPending}
                                  onClick={() => setRetired(c, false)}
                                >
                                  Bring back
                                </MenuItem>
                              ) : (
                                <MenuItem
                                  className={styles.menuItem}
                                  icon={<ArchiveRegular />}
                                  disabled={change.isPending}
                                  onClick={() => setRetired(c, true)}
                                >
                                  Retire
                                </MenuItem>
                              )}
                              <MenuItem
                                className={styles.menuItem}
                                icon={<DeleteRegular />}
                                onClick={() => {
                                  setDeleteError(null);
                                  setDeleting(c);
                                }}
                              >
                                Delete…
                              </MenuItem>
                            </MenuList>
                          </MenuPopover>
                        </Menu>
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
        title={`Delete support class ${deleting?.code ?? ''}?`}
        confirmLabel="Delete class"
        busy={change.isPending}
        problem={deleteError}
        onConfirm={() => void confirmDelete()}
        onCancel={() => setDeleting(null)}
      >
        <p>
          {`${deleting?.code ?? ''} ${deleting?.name ?? ''} leaves the library for good. A class that rounds already use cannot be deleted; retire it instead.`}
        </p>
      </ConfirmDialog>
    </>
  );
}
