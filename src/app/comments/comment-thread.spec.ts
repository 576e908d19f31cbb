import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import type { CommentView } from '../../../shared/api/workflow';
import { CommentThread } from './comment-thread';

const existing: CommentView[] = [
  { id: 'c1', author: { id: 'u1', name: 'Priya Okonkwo-Hale', email: 's@x' }, bodyHtml: '<p>Data attached.</p>', internal: false, createdAt: '2026-11-01T10:00:00Z' },
  { id: 'c2', author: { id: 'u2', name: 'Tomas Lindqvist', email: 'r@x' }, bodyHtml: '<p>Check section sizes.</p>', internal: true, createdAt: '2026-11-02T10:00:00Z' },
];

describe('CommentThread', () => {
  let fixture: ComponentFixture<CommentThread>;
  let http: HttpTestingController;
  let el: HTMLElement;

  function create(allowInternal: boolean): void {
    TestBed.configureTestingModule({ imports: [CommentThread], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CommentThread);
    fixture.componentRef.setInput('requestId', 'r1');
    fixture.componentRef.setInput('allowInternal', allowInternal);
    fixture.detectChanges();
    el = fixture.nativeElement;
    http.expectOne('/api/requests/r1/comments').flush(existing);
    fixture.detectChanges();
  }
  afterEach(() => http.verify());

  function type(text: string): void {
    const box = el.querySelector('textarea') as HTMLTextAreaElement;
    box.value = text;
    box.dispatchEvent(new Event('input'));
    fixture.detectChanges();
  }

  it('lists comments and marks internal notes visibly', () => {
    create(true);
    const items = el.querySelectorAll('.thread li');
    expect(items.length).toBe(2);
    expect(items[1].classList.contains('internal')).toBe(true);
    expect(items[1].textContent).toContain('Internal note — office staff only');
    expect(items[0].querySelector('.body')?.innerHTML).toContain('Data attached.');
  });

  it('posts the converted HTML as an internal note when the toggle is on', () => {
    create(true);
    type('Please add **Welch**.');
    (el.querySelector('mat-checkbox input') as HTMLInputElement).click();
    fixture.detectChanges();
    (el.querySelector('button[type="submit"]') as HTMLButtonElement).click();
    const req = http.expectOne('/api/requests/r1/comments');
    expect(req.request.body).toEqual({ body: '<p>Please add <strong>Welch</strong>.</p>', internal: true });
    req.flush({ id: 'c3', author: null, bodyHtml: '<p>Please add <strong>Welch</strong>.</p>', internal: true, createdAt: '2026-11-03T10:00:00Z' });
    fixture.detectChanges();
    expect(el.querySelectorAll('.thread li').length).toBe(3);
    expect((el.querySelector('textarea') as HTMLTextAreaElement).value).toBe('');
  });

  it('has no internal toggle for submitters and keeps the text when posting fails', () => {
    create(false);
    expect(el.querySelector('mat-checkbox')).toBeNull();
    type('Thanks');
    (el.querySelector('button[type="submit"]') as HTMLButtonElement).click();
    const req = http.expectOne('/api/requests/r1/comments');
    expect(req.request.body.internal).toBe(false);
    req.flush({ error: { status: 422, code: 'validation', message: 'The comment is empty after cleaning.' } }, { status: 422, statusText: 'Unprocessable Entity' });
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('The comment is empty after cleaning.');
    expect((el.querySelector('textarea') as HTMLTextAreaElement).value).toBe('Thanks');
  });
});
