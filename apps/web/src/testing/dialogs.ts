import { screen, waitFor } from '@testing-library/react';

/**
 * Finds an open Fluent dialog by its title.
 *
 * In jsdom, Fluent's focus manager (tabster's modalizer) sets aria-hidden on an open dialog's own surface a
 * moment after it opens; from then on the dialog has no accessible name, so
 * `findByRole('alertdialog', { name, hidden: true })` passes or fails by timing (it failed CI on stop 25
 * while the dialog was on screen with the right title). In a browser the dialog is not hidden: the
 * Playwright specs find dialogs by role and name. Here the dialog is found by role and its title read
 * through aria-labelledby, which does not depend on aria-hidden.
 */
export async function findDialog(title: string | RegExp, role: 'alertdialog' | 'dialog' = 'alertdialog') {
  let found: HTMLElement | undefined;
  await waitFor(() => {
    const dialogs = screen.queryAllByRole(role, { hidden: true });
    found = dialogs.find((dialog) => {
      const text = dialogTitle(dialog);
      return typeof title === 'string' ? text === title : title.test(text);
    });
    if (!found) {
      throw new Error(
        `No open ${role} titled ${String(title)}; open: ${dialogs.map((d) => JSON.stringify(dialogTitle(d))).join(', ') || 'none'}`,
      );
    }
  });
  return found!;
}

function dialogTitle(dialog: HTMLElement): string {
  const ids = (dialog.getAttribute('aria-labelledby') ?? '').split(/\s+/).filter(Boolean);
  return ids
    .map((id) => dialog.ownerDocument.getElementById(id)?.textContent ?? '')
    .join(' ')
    .trim();
}
