import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';

// The axe-core scan the browser specs share (Deque's rules for WCAG 2.x), issue 19 item 12. Light theme: WCAG
// 2.1 A and AA rules (text contrast at least 4.5:1). High-contrast theme: the AAA rules as well, with the AAA
// contrast rule (7:1, color-contrast-enhanced) switched on.

export type Theme = 'light' | 'high-contrast';

export interface AxeFinding {
  rule: string;
  impact: string | null | undefined;
  help: string;
  targets: string[];
}

/** Every violation on screen now (of any impact), less the known false positive below. */
export async function axeFindings(page: Page, theme: Theme): Promise<AxeFinding[]> {
  await page.waitForLoadState('networkidle');
  const tags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
  let builder = new AxeBuilder({ page }).withTags(tags);
  // The high-contrast theme is held to 7:1 (WCAG 2 AAA, 1.4.6), axe's color-contrast-enhanced rule.
  if (theme === 'high-contrast')
    builder = builder
      .withTags([...tags, 'wcag2aaa'])
      .options({ rules: { 'color-contrast-enhanced': { enabled: true } } });
  const { violations } = await builder.analyze();
  const findings: AxeFinding[] = [];
  for (const v of violations) {
    // Fluent UI's focus manager (tabster) places aria-hidden, focusable "dummy" elements that hand focus on at
    // once; screen readers must not announce them. axe's aria-hidden-focus flags them: a known false positive
    // (microsoft/tabster#288, microsoft/fluentui#27517 "by design"). Only those nodes are left out.
    const nodes = v.nodes.filter(
      (n) =>
        !(v.id === 'aria-hidden-focus' && /data-tabster-dummy|data-is-focus-trap-zone-bumper/.test(n.html)),
    );
    if (nodes.length === 0) continue;
    findings.push({
      rule: v.id,
      impact: v.impact,
      help: v.help,
      targets: nodes.slice(0, 8).map((n) => `${n.target.join(' ')} ${n.failureSummary ?? ''}`.trim()),
    });
  }
  return findings;
}

export const isSerious = (f: AxeFinding): boolean => f.impact === 'serious' || f.impact === 'critical';
