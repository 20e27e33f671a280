import { can } from './permissions';

describe('can', () => {
  it('lets only leads and admins review', () => {
    expect(['admin', 'lead', 'analyst', 'viewer'].filter((role) => can(role as never, 'review'))).toEqual(['admin', 'lead']);
  });

  it('lets only admins administer', () => {
    expect(['admin', 'lead', 'analyst', 'viewer'].filter((role) => can(role as never, 'administer'))).toEqual(['admin']);
  });

  it('gives a viewer nothing that changes data', () => {
    const changes = ['createStudy', 'archiveStudy', 'manageMembers', 'runAnalysis', 'review', 'administer'] as const;
    expect(changes.filter((permission) => can('viewer', permission))).toEqual([]);
  });

  it('lets every role that reads an analysis comment on it', () => expect(can('viewer', 'comment')).toBe(true));

  it('gives nobody signed out anything', () => expect(can(null, 'comment')).toBe(false));
});
