import { hasAnyRole, Role } from '@meritline/shared';
import { paths } from '@/lib/config/paths';

export interface NavItem {
  label: string;
  href: string;
  /** One line for the overview page's shortcuts. */
  summary: string;
  /** Who sees the entry; everyone when left out. */
  roles?: readonly Role[];
}

export interface NavSection {
  label: string;
  items: readonly NavItem[];
}

export const NAVIGATION: readonly NavSection[] = [
  {
    label: 'Start',
    items: [{ label: 'Overview', href: paths.home.getHref(), summary: 'Your roles and shortcuts.' }],
  },
  {
    label: 'Bench work',
    items: [
      {
        label: 'Validation studies',
        href: paths.studies.getHref(),
        summary: 'Calibrate with standards and check linearity, LOD/LOQ, recovery and precision.',
        roles: [Role.Analyst, Role.Admin],
      },
      {
        label: 'Routine batches',
        href: paths.runs.getHref(),
        summary: 'Quantify samples against a released method and its calibration.',
        roles: [Role.Analyst],
      },
    ],
  },
  {
    label: 'Traceable standards',
    items: [
      {
        label: 'Standard preparations',
        href: paths.preparations.getHref(),
        summary: 'Prepare a stock and working standards from a reference material, with their uncertainty.',
        roles: [Role.Analyst],
      },
      {
        label: 'Reference materials',
        href: paths.referenceMaterials.getHref(),
        summary: 'Certified materials, their certificates, lots and expiry dates.',
      },
    ],
  },
  {
    label: 'Second person review',
    items: [
      {
        label: 'Review queue',
        href: paths.reviews.getHref(),
        summary: 'Check studies and batches submitted by analysts, then sign or send back.',
        roles: [Role.Reviewer],
      },
    ],
  },
  {
    label: 'Quality',
    items: [
      {
        label: 'Methods',
        href: paths.methods.getHref(),
        summary: 'Define methods, their acceptance criteria and released versions.',
        roles: [Role.QualityManager],
      },
      {
        label: 'Version comparison',
        href: paths.methodComparison.getHref(),
        summary: 'See what changed between two versions of a method.',
        roles: [Role.QualityManager],
      },
      {
        label: 'Audit trail',
        href: paths.auditTrail.getHref(),
        summary: 'Read who changed what and why, check the chain and sign its review.',
        roles: [Role.QualityManager, Role.Admin],
      },
      {
        label: 'Self-qualification',
        href: paths.qualification.getHref(),
        summary: 'Recompute published reference values and keep a signed report of the agreement.',
        roles: [Role.QualityManager, Role.Admin],
      },
    ],
  },
  {
    label: 'Administration',
    items: [
      {
        label: 'Users',
        href: paths.users.getHref(),
        summary: 'Invite people, assign roles, deactivate accounts.',
        roles: [Role.Admin],
      },
      {
        label: 'Outbox',
        href: paths.outbox.getHref(),
        summary: 'Read the e-mails Meritline has sent.',
        roles: [Role.Admin],
      },
    ],
  },
  {
    label: 'Reports',
    items: [
      {
        label: 'Verify a report',
        href: paths.verify.getHref(),
        summary: 'Check that a signed report is authentic and unchanged.',
      },
    ],
  },
];

/** The sections and entries a user sees: the union over all the roles they hold. */
export function navigationFor(roles: readonly string[]): NavSection[] {
  return NAVIGATION.map((section) => ({
    ...section,
    items: section.items.filter((item) => !item.roles || hasAnyRole(roles, item.roles)),
  })).filter((section) => section.items.length > 0);
}
