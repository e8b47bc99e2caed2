import { Badge } from '@fluentui/react-components';
import type { BadgeProps } from '@fluentui/react-components';

export type ProjectRole = 'admin' | 'geologist' | 'engineer' | 'supervisor' | 'viewer';

/** How each project role is named on screen. */
export const roleLabels: Record<ProjectRole, string> = {
  admin: 'Project admin',
  geologist: 'Geologist',
  engineer: 'Engineer',
  supervisor: 'Shift supervisor',
  viewer: 'Read only',
};

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
