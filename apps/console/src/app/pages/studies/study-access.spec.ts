import { managesStudy, runsInStudy } from './study-access';

describe('study access in the console', () => {
  it('lets admins and owning analysts manage a study, nobody else', () => {
    expect(managesStudy('admin', { myStudyRole: null })).toBe(true);
    expect(managesStudy('analyst', { myStudyRole: 'owner' })).toBe(true);
    expect(managesStudy('analyst', { myStudyRole: 'contributor' })).toBe(false);
    expect(managesStudy('lead', { myStudyRole: null })).toBe(false);
    expect(managesStudy('viewer', { myStudyRole: 'reader' })).toBe(false);
  });

  it('lets contributors run analyses but not in an archived study', () => {
    expect(runsInStudy('analyst', { myStudyRole: 'contributor', archived: false })).toBe(true);
    expect(runsInStudy('analyst', { myStudyRole: 'reader', archived: false })).toBe(false);
    expect(runsInStudy('admin', { myStudyRole: null, archived: true })).toBe(false);
    expect(runsInStudy('viewer', { myStudyRole: 'reader', archived: false })).toBe(false);
  });
});
