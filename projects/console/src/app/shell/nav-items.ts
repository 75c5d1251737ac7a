import type { Permission } from '../api/api-types';

/** One entry of the side navigation. */
export interface NavItem {
  readonly label: string;
  readonly icon: string;
  readonly link: string;
  /** Needed to see the entry (the screen's guard and the API check it again). */
  readonly permission?: Permission;
  /** Shown only when the server's development mailbox is on. */
  readonly needsMailbox?: boolean;
}

/** A titled group of entries. */
export interface NavGroup {
  readonly title: string;
  readonly items: readonly NavItem[];
}

/** The side navigation, in the order people use it. */
export const NAV_GROUPS: readonly NavGroup[] = [
  {
    title: 'Loops',
    items: [
      { label: 'Models', icon: 'timeline', link: '/models' },
      { label: 'Import and export', icon: 'swap_vert', link: '/transfer' },
      { label: 'Embed', icon: 'code', link: '/embed' },
    ],
  },
  {
    title: 'Administration',
    items: [
      { label: 'API keys', icon: 'vpn_key', link: '/keys', permission: 'admin' },
      { label: 'People', icon: 'group', link: '/people', permission: 'admin' },
      { label: 'Audit log', icon: 'fact_check', link: '/audit', permission: 'admin' },
      { label: 'Mailbox', icon: 'mail', link: '/mailbox', permission: 'admin', needsMailbox: true },
    ],
  },
];
