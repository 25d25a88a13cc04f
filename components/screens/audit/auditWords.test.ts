import { auditSentence, changedFields } from './auditWords';

describe('audit log in words', () => {
  it('says who changed which setting of which record from what to what', () => {
    const event = {
      action: 'meter-run.update',
      entityType: 'meter-run',
      entityId: '7',
      before: { id: 7, tag: 'KFG-101', maxGapS: 300 },
      after: { id: 7, tag: 'KFG-101', maxGapS: 600 },
    };
    expect(auditSentence(event, 'Dana Reyes')).toBe(
      "Dana Reyes changed meter run KFG-101's gap limit from 5 min to 10 min",
    );
  });

  it('lists the changed fields as old and new values, leaving out unchanged and bookkeeping fields', () => {
    expect(
      changedFields(
        { name: 'North', contractHour: 6, updatedAt: '2026-12-01T00:00:00Z', disabled: false },
        { name: 'North', contractHour: 7, updatedAt: '2026-12-02T00:00:00Z', disabled: true },
      ),
    ).toEqual([
      { field: 'contract hour', before: '6', after: '7' },
      { field: 'disabled', before: 'no', after: 'yes' },
    ]);
  });

  it('says an added record by its name and a sign-in without a record', () => {
    expect(auditSentence({ action: 'site.create', entityType: 'site', after: { code: 'KFG' } }, 'Ann Lee')).toBe(
      'Ann Lee added site KFG',
    );
    expect(auditSentence({ action: 'auth.sign-in', entityType: 'sign-in' }, 'Ann Lee')).toBe('Ann Lee signed in');
  });
});
