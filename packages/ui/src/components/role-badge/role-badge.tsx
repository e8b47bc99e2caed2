import { Badge } from '@fluentui/react-components';
import type { BadgeProps } from '@fluentui/react-components';
import { roleLabels, type ProjectRole } from '@roundbook/domain';

// How each project role is named: packages/domain's vocabulary (the same words in e-mails and reports).
export { roleLabels, type ProjectRole };

const roleColours: Record<ProjectRole, BadgeProps['color']> = {
  admin: 'brand',
  geologist: 'informative',
  engineer: 'important',
  supervisor: 'severe',
  viewer: 'subtle',
};

export interface RoleBadgeProps {
  role: ProjectRole;
  size?: BadgeProps['size'];
}

export function RoleBadge({ role, size = 'large' }: RoleBadgeProps) {
  return (
    <Badge appearance="tint" shape="rounded" size={size} color={roleColours[role]}>
      {roleLabels[role]}
    </Badge>
  );
}
