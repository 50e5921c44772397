/** The admin sections: the /admin index and the navigation above each admin page. */
export const ADMIN_SECTIONS = [
  {
    href: '/admin/people',
    label: 'People',
    summary: 'Everyone with role, seasons, subsystems and last sign-in; change roles and who owns what this season.',
  },
  {
    href: '/admin/invitations',
    label: 'Invitations',
    summary: 'Invite new people by e-mail; resend or revoke pending invitations.',
  },
  {
    href: '/admin/outbox',
    label: 'Outbox',
    summary: 'The e-mail Wakebook captured locally while no SMTP server is set.',
  },
  {
    href: '/admin/audit',
    label: 'Audit log',
    summary: 'Sign-ins, failed sign-ins, invitations, role changes, writes and exports: who, what, when.',
  },
  {
    href: '/admin/export',
    label: 'Handover bundle & backup',
    summary: 'Download the whole archive as a zip readable without a server, or a database backup.',
  },
  {
    href: '/admin/digest',
    label: 'Digest',
    summary: 'The weekly e-mail for people who opted in: send it now, or see how to schedule it.',
  },
] as const;
