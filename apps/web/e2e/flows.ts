// Steps several browser specs share: signing in as a demo user, and opening a new round on HR-U.
import { expect, type Page } from '@playwright/test';

export const demoPassword = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';

/** Signs in on the sign-in page as a demo user and waits for the Board. */
export async function signInAs(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/$/);
}

/**
 * As the demo geologist: Board → HR-U (by the card's title; its other links lead to the review count and the
 * handovers) → New round on the first stage, with the face chainage prefilled from /next → the round.
 */
export async function openNewRoundOnHrU(page: Page): Promise<void> {
  await signInAs(page, 'geologist@roundbook.test');
  await page
    .getByTestId('heading-card')
    .filter({ hasText: 'HR-U' })
    .getByRole('heading', { level: 3 })
    .getByRole('link')
    .click();
  await page.getByRole('button', { name: 'New round' }).click();
  const dialog = page.getByRole('region', { name: 'New round on HR-U' });
  const stages = dialog.getByRole('radio');
  if ((await stages.count()) > 1) await stages.first().click();
  await expect(dialog.getByTestId('next-round')).toBeVisible();
  await expect(dialog.getByLabel('Face chainage')).not.toHaveValue('');
  await dialog.getByRole('button', { name: 'Open the round' }).click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/rounds\/[^/]+$/);
}
