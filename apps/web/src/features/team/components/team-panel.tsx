import {
  Badge,
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Spinner,
  Subtitle1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { DeleteRegular, MailArrowUpRegular, PersonAddRegular } from '@fluentui/react-icons';
import {
  ConfirmDialog,
  FormikInputField,
  FormikSelectField,
  RoleBadge,
  roleLabels,
  TOUCH_TARGET_PX,
} from '@roundbook/ui';
import { Form, Formik } from 'formik';
import type { FormikHelpers } from 'formik';
import { useState } from 'react';
import type { InviteRequest, ProjectRole, TeamMember } from '@/api/contract';
import { useChangeTeam, useTeam } from '@/features/team/api/team';
import { inviteSchema, PROJECT_ROLES } from '@/features/team/schemas/team.schema';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';

export interface TeamPanelProps {
  projectId: string;
  canEdit: boolean;
  /** The signed-in person, so they see which row is theirs. */
  myUserId: string;
  timeZone: string;
}

const useStyles = makeStyles({
  section: { marginBottom: tokens.spacingVerticalXXL },
  heading: { display: 'block', margin: `0 0 ${tokens.spacingVerticalM}` },
  wrap: { overflowX: 'auto' },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  select: { minWidth: '11rem', '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  // 48 px targets with 8 px between them (a gloved tap does not hit the neighbour).
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  invite: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'end',
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  wide: { gridColumn: '1 / -1' },
  problem: { marginBottom: tokens.spacingVerticalM },
});

function when(iso: string, timeZone: string): string {
  const options: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };
  try {
    return new Intl.DateTimeFormat('en-GB', { ...options, timeZone }).format(new Date(iso));
  } catch {
    return new Intl.DateTimeFormat('en-GB', options).format(new Date(iso));
  }
}

const roleOptions = PROJECT_ROLES.map((r) => ({ value: r, label: roleLabels[r] }));

function InviteForm({ projectId }: { projectId: string }) {
  const styles = useStyles();
  const change = useChangeTeam(projectId);
  const [problem, setProblem] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);

  const submit = async (values: Required<InviteRequest>, helpers: FormikHelpers<Required<InviteRequest>>) => {
    setProblem(null);
    setSent(null);
    const body = inviteSchema.validateSync(values);
    try {
      await change.mutateAsync({ kind: 'invite', body: { ...body, name: body.name || undefined } });
      setSent(`Invitation sent to ${body.email}.`);
      helpers.resetForm();
    } catch (error) {
      setProblem(applyServerErrors(error, helpers, values));
    }
  };

  return (
    <Formik<Required<InviteRequest>>
      initialValues={{ email: '', name: '', role: 'geologist' }}
      validationSchema={inviteSchema}
      onSubmit={submit}
    >
      {({ isSubmitting }) => (
        <Form className={styles.invite} noValidate aria-label="Invite someone">
          <FormikInputField name="email" label="E-mail" type="email" inputMode="email" required />
          <FormikInputField name="name" label="Name (optional)" />
          <FormikSelectField name="role" label="Role in this project" options={roleOptions} required />
          <Button
            type="submit"
            size="large"
            appearance="primary"
            className={styles.button}
            icon={isSubmitting ? <Spinner size="tiny" /> : <PersonAddRegular />}
            disabled={isSubmitting}
          >
            Send invitation
          </Button>
          {(problem !== null || sent !== null) && (
            <div className={styles.wide} role={problem !== null ? 'alert' : 'status'}>
              <MessageBar intent={problem !== null ? 'error' : 'success'} layout="multiline">
                <MessageBarBody>{problem ?? sent}</MessageBarBody>
              </MessageBar>
            </div>
          )}
        </Form>
      )}
    </Formik>
  );
}

/** Members with their roles, open invitations, and (for admins) the invitation form. */
export function TeamPanel({ projectId, canEdit, myUserId, timeZone }: TeamPanelProps) {
  const styles = useStyles();
  const { data: team } = useTeam(projectId);
  const change = useChangeTeam(projectId);
  const [problem, setProblem] = useState<string | null>(null);
  const [removing, setRemoving] = useState<TeamMember | null>(null);
  const [removeError, setRemoveError] = useState<string | null>(null);
  const [withdrawing, setWithdrawing] = useState<{ id: string; email: string } | null>(null);
  const [withdrawError, setWithdrawError] = useState<string | null>(null);

  const act = async (run: () => Promise<unknown>) => {
    setProblem(null);
    try {
      await run();
    } catch (error) {
      setProblem(isApiError(error) ? error.message : 'That did not work. Try again.');
    }
  };

  const confirmWithdraw = async () => {
    if (withdrawing === null) return;
    setWithdrawError(null);
    try {
      await change.mutateAsync({ kind: 'withdraw', invitationId: withdrawing.id });
      setWithdrawing(null);
    } catch (error) {
      setWithdrawError(
        isApiError(error) ? error.message : 'The invitation could not be withdrawn. Try again.',
      );
    }
  };

  const confirmRemove = async () => {
    if (removing === null) return;
    setRemoveError(null);
    try {
      await change.mutateAsync({ kind: 'remove', memberId: removing.memberId });
      setRemoving(null);
    } catch (error) {
      setRemoveError(isApiError(error) ? error.message : 'They could not be removed. Try again.');
    }
  };

  return (
    <>
      {problem !== null && (
        <div role="alert" className={styles.problem}>
          <MessageBar intent="error" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>Not changed</MessageBarTitle>
              {problem}
            </MessageBarBody>
          </MessageBar>
        </div>
      )}
      <section className={styles.section} aria-label="Members">
        <Subtitle1 as="h2" className={styles.heading}>{`Members (${team.members.length})`}</Subtitle1>
        <div className={styles.wrap}>
          <Table aria-label="Members">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Name</TableHeaderCell>
                <TableHeaderCell>E-mail</TableHeaderCell>
                <TableHeaderCell>Role</TableHeaderCell>
                <TableHeaderCell>Since</TableHeaderCell>
                {canEdit && <TableHeaderCell>Remove</TableHeaderCell>}
              </TableRow>
            </TableHeader>
            <TableBody>
              {team.members.map((m) => (
                <TableRow key={m.memberId}>
                  <TableCell>
                    {m.name} {m.userId === myUserId && <Badge appearance="outline">you</Badge>}
                  </TableCell>
                  <TableCell>{m.email}</TableCell>
                  <TableCell>
                    {canEdit ? (
                      <Select
                        className={styles.select}
                        size="large"
                        aria-label={`Role of ${m.name}`}
                        value={m.role}
                        disabled={change.isPending}
                        onChange={(_e, d) =>
                          void act(() =>
                            change.mutateAsync({
                              kind: 'role',
                              memberId: m.memberId,
                              role: d.value as ProjectRole,
                            }),
                          )
                        }
                      >
                        {roleOptions.map((o) => (
                          <option key={o.value} value={o.value}>
                            {o.label}
                          </option>
                        ))}
                      </Select>
                    ) : (
                      <RoleBadge role={m.role} size="medium" />
                    )}
                  </TableCell>
                  <TableCell>{when(m.since, timeZone)}</TableCell>
                  {canEdit && (
                    <TableCell>
                      <Button
                        className={styles.button}
                        icon={<DeleteRegular />}
                        aria-label={`Remove ${m.name} from the project`}
                        onClick={() => {
                          setRemoveError(null);
                          setRemoving(m);
                        }}
                      />
                    </TableCell>
                  )}
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </div>
      </section>

      <section className={styles.section} aria-label="Open invitations">
        <Subtitle1
          as="h2"
          className={styles.heading}
        >{`Open invitations (${team.invitations.length})`}</Subtitle1>
        {team.invitations.length === 0 ? (
          <p>No invitations waiting.</p>
        ) : (
          <div className={styles.wrap}>
            <Table aria-label="Open invitations">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>E-mail</TableHeaderCell>
                  <TableHeaderCell>Role</TableHeaderCell>
                  <TableHeaderCell>Link valid until</TableHeaderCell>
                  <TableHeaderCell>E-mail sent</TableHeaderCell>
                  {canEdit && <TableHeaderCell>Change</TableHeaderCell>}
                </TableRow>
              </TableHeader>
              <TableBody>
                {team.invitations.map((i) => (
                  <TableRow key={i.id}>
                    <TableCell>{i.name === '' ? i.email : `${i.name} <${i.email}>`}</TableCell>
                    <TableCell>
                      <RoleBadge role={i.role} size="medium" />
                    </TableCell>
                    <TableCell>{when(i.expiresAt, timeZone)}</TableCell>
                    <TableCell>
                      {i.emailStatus === 'sent' ? (
                        <Badge appearance="tint" color="success">
                          Sent
                        </Badge>
                      ) : i.emailStatus === 'queued' ? (
                        <Badge appearance="tint" color="informative">
                          Queued: goes out shortly
                        </Badge>
                      ) : (
                        <Badge appearance="filled" color="warning">
                          Not sent: resend
                        </Badge>
                      )}
                    </TableCell>
                    {canEdit && (
                      <TableCell>
                        <div className={styles.actions}>
                          <Button
                            className={styles.button}
                            icon={<MailArrowUpRegular />}
                            disabled={change.isPending}
                            aria-label={`Send the invitation to ${i.email} again`}
                            onClick={() =>
                              void act(() => change.mutateAsync({ kind: 'resend', invitationId: i.id }))
                            }
                          >
                            Resend
                          </Button>
                          <Button
                            className={styles.button}
                            icon={<DeleteRegular />}
                            disabled={change.isPending}
                            aria-label={`Withdraw the invitation to ${i.email}`}
                            onClick={() => {
                              setWithdrawError(null);
                              setWithdrawing({ id: i.id, email: i.email });
                            }}
                          >
                            Withdraw
                          </Button>
                        </div>
                      </TableCell>
                    )}
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </div>
        )}
      </section>

      {canEdit && (
        <section className={styles.section} aria-label="Invite someone">
          <Subtitle1 as="h2" className={styles.heading}>
            Invite someone
          </Subtitle1>
          <InviteForm projectId={projectId} />
        </section>
      )}

      <ConfirmDialog
        open={withdrawing !== null}
        title={`Withdraw the invitation to ${withdrawing?.email ?? ''}?`}
        confirmLabel="Withdraw the invitation"
        busy={change.isPending}
        problem={withdrawError}
        onConfirm={() => void confirmWithdraw()}
        onCancel={() => setWithdrawing(null)}
      >
        <p>The link in their e-mail stops working at once. You can invite them again at any time.</p>
      </ConfirmDialog>
      <ConfirmDialog
        open={removing !== null}
        title={`Remove ${removing?.name ?? ''} from the project?`}
        confirmLabel="Remove from project"
        busy={change.isPending}
        problem={removeError}
        onConfirm={() => void confirmRemove()}
        onCancel={() => setRemoving(null)}
      >
        <p>
          They lose access to this project at once. Everything they recorded stays, with their name on it.
        </p>
      </ConfirmDialog>
    </>
  );
}
