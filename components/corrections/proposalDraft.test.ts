import { emptyDraft, proposalFromDraft, type ProposalDraft } from './proposalDraft';

const draft = (overrides: Partial<ProposalDraft>): ProposalDraft => ({
  ...emptyDraft,
  meterRunId: '4',
  startDate: '2026-06-20',
  startTime: '09:00',
  endDate: '2026-06-21',
  endTime: '09:00',
  reason: 'radio link down',
  ...overrides,
});

describe('proposalFromDraft', () => {
  it('reads the period on the site’s clock (Denver in summer is UTC−6) and sends a quantity', () => {
    const out = proposalFromDraft(draft({ massKg: '1250.5' }), 'America/Denver');
    expect(out).toEqual({
      ok: true,
      proposal: {
        meterRunId: '4',
        start: '2026-06-20T09:00:00-06:00',
        end: '2026-06-21T09:00:00-06:00',
        kind: 'substitute',
        massKg: 1250.5,
        origin: 'manual',
        reason: 'radio link down',
      },
    });
  });

  it('sends an adjustment with its factor, and a held reading substitution', () => {
    const adjust = proposalFromDraft(draft({ mode: 'factor', factor: '1,02' }), 'UTC');
    expect(adjust.ok && adjust.proposal).toMatchObject({ kind: 'adjust', factor: 1.02 });
    const held = proposalFromDraft(draft({ mode: 'readings', transmitterId: '9', hold: true }), 'UTC');
    expect(held.ok && held.proposal).toMatchObject({
      kind: 'substitute',
      substitute: { transmitterId: '9', hold: true },
    });
  });

  it('names every field at fault', () => {
    const out = proposalFromDraft(
      draft({ meterRunId: '', startTime: '09:30', mode: 'factor', factor: '0', reason: ' ' }),
      'UTC',
    );
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(Object.keys(out.errors).sort()).toEqual(['factor', 'meterRunId', 'reason', 'start']);
  });

  it('refuses an end before the start, naming end', () => {
    const out = proposalFromDraft(draft({ endDate: '2026-06-19', massKg: '1' }), 'UTC');
    expect(out.ok === false && out.errors.end).toMatch(/after the start/);
  });
});
