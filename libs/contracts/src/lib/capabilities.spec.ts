import { can, CAPABILITIES, CAPABILITY_NAMES } from './capabilities';
import { ROLES } from './roles';

/**
 * The role rules the product promises (DEVELOPERS.md, "Capabilities"), checked against the table. (The API's role
 * matrix test proves every route answers as `can()` says.)
 */
describe('the capability table', () => {
  const rolesWith = (capability: (typeof CAPABILITY_NAMES)[number]) => ROLES.filter((role) => can(role, capability));

  it('gives a viewer nothing that changes shared data', () => {
    const changes = CAPABILITY_NAMES.filter((name) => /\.(create|manage|run|review|add|share)$/.test(name));
    expect(changes.filter((capability) => can('viewer', capability))).toEqual([]);
  });

  it('lets leads and admins review and read the audit trail, and only admins manage people', () => {
    expect(rolesWith('analyses.review')).toEqual(['admin', 'lead']);
    expect(rolesWith('audit.read')).toEqual(['admin', 'lead']);
    expect(rolesWith('people.manage')).toEqual(['admin']);
  });

  it('lets study owners and admins manage a study, and nobody else', () => {
    expect(can('analyst', 'studies.manage', 'owner')).toBe(true);
    expect(can('analyst', 'studies.manage', 'contributor')).toBe(false);
    expect(can('analyst', 'studies.manage', null)).toBe(false);
    expect(can('admin', 'studies.manage', null)).toBe(true);
    expect(can('lead', 'studies.manage', 'owner')).toBe(false);
  });

  it('lets owners and contributors run analyses in a study, readers not', () => {
    expect(can('analyst', 'analyses.run', 'contributor')).toBe(true);
    expect(can('analyst', 'analyses.run', 'reader')).toBe(false);
    expect(can('viewer', 'analyses.run', 'owner')).toBe(false);
  });

  it('gives nobody signed out anything', () => {
    expect(CAPABILITY_NAMES.filter((capability) => can(null, capability))).toEqual([]);
  });

  it('describes every capability for the API document', () => {
    for (const name of CAPABILITY_NAMES) expect(CAPABILITIES[name].description.length).toBeGreaterThan(10);
  });
});
