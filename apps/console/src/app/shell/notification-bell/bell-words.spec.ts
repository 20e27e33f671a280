import { badgeText, bellLabel } from './bell-words';

describe('the bell', () => {
  it('shows no badge at zero, the count up to 9, then 9+', () => {
    expect(badgeText(0)).toBeNull();
    expect(badgeText(1)).toBe('1');
    expect(badgeText(9)).toBe('9');
    expect(badgeText(12)).toBe('9+');
  });

  it('tells a screen reader the full count', () => {
    expect(bellLabel(0)).toBe('Notifications, none unread');
    expect(bellLabel(12)).toBe('Notifications, 12 unread');
  });
});
