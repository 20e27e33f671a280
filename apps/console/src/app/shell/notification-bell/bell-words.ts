/** What the bell's badge shows: nothing at zero, the count up to 9, then "9+" so the badge stays round. */
export function badgeText(unread: number): string | null {
  if (unread <= 0) return null;
  return unread > 9 ? '9+' : String(unread);
}

/** The bell's name for screen readers, with the full count. */
export function bellLabel(unread: number): string {
  if (unread <= 0) return 'Notifications, none unread';
  return `Notifications, ${unread} unread`;
}
