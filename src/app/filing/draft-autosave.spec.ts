import { HttpErrorResponse } from '@angular/common/http';
import { from, of, throwError } from 'rxjs';
import type { RequestDetail } from '../../../shared/api/types';
import { emptyPlanDraft } from '../../../shared/review/plan-mapping';
import { DraftAutosave } from './draft-autosave';
import type { DraftFields } from './filing-draft';
import type { FilingService } from './filing-service';

const fields = (over: Partial<DraftFields> = {}): DraftFields => ({
  title: 'Peer mentoring and retention', purpose: '', decisionInformed: '', audience: '', samplingNotes: '', deadline: null, departmentId: null,
  designKind: null, plan: emptyPlanDraft(0.05), reported: [], ...over,
});

const detail = (version: number, id = 'r1') => ({ id, reference: 'HV-2026-021', version, state: 'draft' } as unknown as RequestDetail);

function fakeApi() {
  return {
    create: vi.fn((_b: unknown) => of(detail(0))),
    save: vi.fn((_id: string, _b: unknown) => of(detail(4))),
  };
}

describe('DraftAutosave', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('waits for a pause in typing, then PATCHes only the changed fields with the version last read', async () => {
    const api = fakeApi();
    let current = fields();
    const a = new DraftAutosave(api as unknown as FilingService, () => current, undefined, 1000);
    a.startFrom(detail(3), fields());
    current = fields({ purpose: 'W' });
    a.schedule();
    await vi.advanceTimersByTimeAsync(600);
    current = fields({ purpose: 'Which mentoring format' });
    a.schedule();
    expect(a.status()).toBe('pending');
    await vi.advanceTimersByTimeAsync(600);
    expect(api.save).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(500);
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(api.save).toHaveBeenCalledWith('r1', { purpose: 'Which mentoring format', version: 3 });
    expect(a.status()).toBe('saved');
    expect(a.version()).toBe(4);
    expect(a.savedAt()).not.toBeNull();
  });

  it('creates the draft on the first save that has a title, and not before', async () => {
    const api = fakeApi();
    let current = fields({ title: '' });
    const created: string[] = [];
    const a = new DraftAutosave(api as unknown as FilingService, () => current, (d, isNew) => isNew && created.push(d.id), 10);
    a.schedule();
    await vi.advanceTimersByTimeAsync(20);
    expect(a.status()).toBe('needs-title');
    expect(api.create).not.toHaveBeenCalled();
    current = fields({ title: 'Tutoring drop-in hours', reported: [{ text: 't(40) = 2.10, p = .042' }] });
    a.schedule();
    await vi.advanceTimersByTimeAsync(20);
    expect(api.create).toHaveBeenCalledTimes(1);
    expect(api.create.mock.calls[0][0]).not.toHaveProperty('reported');
    expect(created).toEqual(['r1']);
    // The reported results follow in a PATCH, since the create body has none.
    await vi.advanceTimersByTimeAsync(0);
    expect(api.save).toHaveBeenCalledWith('r1', { reported: [{ text: 't(40) = 2.10, p = .042' }], version: 0 });
  });

  it('stops saving on 409 and keeps the typed fields untouched', async () => {
    const api = fakeApi();
    api.save.mockReturnValueOnce(throwError(() => new HttpErrorResponse({ status: 409, error: { error: { status: 409, code: 'conflict', message: 'Someone else changed this request.' } } })));
    let current = fields({ audience: 'Academic Council' });
    const a = new DraftAutosave(api as unknown as FilingService, () => current, undefined, 10);
    a.startFrom(detail(3), fields());
    a.schedule();
    await vi.advanceTimersByTimeAsync(20);
    expect(a.status()).toBe('conflict');
    expect(a.message()).toContain('Someone else changed');
    current = fields({ audience: 'Academic Council and deans' });
    a.schedule();
    await vi.advanceTimersByTimeAsync(50);
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(await a.flush()).toBe(false);
    expect(current.audience).toBe('Academic Council and deans');
  });

  it('saves the valid fields and holds back one the shared schema rejects, naming it', async () => {
    const api = fakeApi();
    const bad = { ...emptyPlanDraft(0.05), designKind: 'two-independent' as const, alpha: 0.7 };
    const current = fields({ purpose: 'Retention after one year', plan: bad });
    const a = new DraftAutosave(api as unknown as FilingService, () => current, undefined, 10);
    a.startFrom(detail(2), fields());
    a.schedule();
    await vi.advanceTimersByTimeAsync(20);
    expect(api.save).toHaveBeenCalledWith('r1', { purpose: 'Retention after one year', version: 2 });
    expect(a.status()).toBe('error');
    expect(Object.keys(a.fieldErrors())).toEqual(['plan.alpha']);
    expect(a.fieldErrors()['plan.alpha']).toContain('below 0.5');
  });

  it('never runs two saves at once: a change during a save is saved right after it', async () => {
    const api = fakeApi();
    let release!: () => void;
    api.save.mockImplementationOnce(() => from(new Promise<RequestDetail>((r) => { release = () => r(detail(5)); })));
    let current = fields({ purpose: 'a' });
    const a = new DraftAutosave(api as unknown as FilingService, () => current, undefined, 10);
    a.startFrom(detail(4), fields());
    a.schedule();
    await vi.advanceTimersByTimeAsync(20);
    expect(a.status()).toBe('saving');
    current = fields({ purpose: 'ab' });
    a.schedule();
    await vi.advanceTimersByTimeAsync(20);
    expect(api.save).toHaveBeenCalledTimes(1);
    release();
    await vi.advanceTimersByTimeAsync(0);
    await vi.advanceTimersByTimeAsync(0);
    expect(api.save).toHaveBeenCalledTimes(2);
    expect(api.save.mock.calls[1]).toEqual(['r1', { purpose: 'ab', version: 5 }]);
  });
});
