import { ADMIN_NAV, MAIN_NAV, visibleTo } from './nav-items';

const labels = (items: { label: string }[]) => items.map((item) => item.label);

describe('navigation by role', () => {
  it('offers a viewer places to read and the planner, which computes without storing anything', () => {
    expect(labels(visibleTo(MAIN_NAV, 'viewer'))).toEqual(['Studies', 'History', 'My analyses', 'Planner']);
    expect(visibleTo(ADMIN_NAV, 'viewer')).toEqual([]);
  });

  it('offers nobody signed out anything', () => {
    expect(visibleTo(MAIN_NAV, null)).toEqual([]);
  });

  it('offers a lead the audit trail but not people or the outbox', () => {
    expect(labels(visibleTo(ADMIN_NAV, 'lead'))).toEqual(['Audit trail']);
    expect(labels(visibleTo(MAIN_NAV, 'lead'))).not.toContain('New analysis');
  });

  it('offers an admin everything', () => {
    expect(labels(visibleTo(ADMIN_NAV, 'admin'))).toEqual(['People', 'Audit trail', 'Mail outbox']);
    expect(labels(visibleTo(MAIN_NAV, 'admin'))).toContain('New analysis');
  });
});
