/** Notification wording: every event has text and HTML with the link and office; user text is escaped. */
import { describe, expect, it } from 'vitest';
import { NOTIFY_EVENTS } from '../../shared/api/workflow';
import { escapeHtml, renderMessage, type TemplateInput } from './mail-templates';

const input = (over: Partial<TemplateInput> = {}): TemplateInput => ({
  event: 'request.assigned', reference: 'HV-2026-031', title: 'Tutoring <b>hours</b> & "grades"', officeName: 'Harrow Vale OIE',
  link: 'http://127.0.0.1:4280/requests/abc', recipientName: 'Imani <Castellanos>', actorName: 'Ruth', extra: {}, ...over,
});

describe('renderMessage', () => {
  it.each(NOTIFY_EVENTS.map((e) => [e]))('%s: subject with the reference, link and office in text and HTML', (event) => {
    const m = renderMessage(input({ event }));
    expect(m.subject).toContain('HV-2026-031');
    expect(m.text).toContain('http://127.0.0.1:4280/requests/abc');
    expect(m.text).toContain('Harrow Vale OIE');
    expect(m.html).toContain('href="http://127.0.0.1:4280/requests/abc"');
    expect(m.html).toContain('Harrow Vale OIE');
    expect(m.summary.length).toBeGreaterThan(10);
  });

  it('escapes user text in the HTML but keeps it readable in plain text', () => {
    const m = renderMessage(input({ extra: { note: '<script>alert(1)</script>', dueAt: '2026-12-16' } }));
    expect(m.html).not.toContain('<script>');
    expect(m.html).not.toContain('<b>hours</b>');
    expect(m.html).toContain('Tutoring &lt;b&gt;hours&lt;/b&gt; &amp; &quot;grades&quot;');
    expect(m.html).toContain('Imani &lt;Castellanos&gt;');
    expect(m.text).toContain('Tutoring <b>hours</b>');
    expect(m.text).toContain('2026-12-16');
  });

  it('names the decision and the decline reason in words', () => {
    expect(renderMessage(input({ event: 'request.decided', extra: { decision: 'endorse-with-conditions' } })).text).toContain('endorsed with conditions');
    expect(renderMessage(input({ event: 'assignment.declined', extra: { reason: 'conflict' } })).text).toContain('conflict of interest');
  });

  it('never attaches the letter: the letter mail points to the request page', () => {
    expect(renderMessage(input({ event: 'letter.ready' })).text).toMatch(/Download it from the request page/);
  });

  it('escapeHtml covers the five special characters', () => {
    expect(escapeHtml(`<a href="x" title='y'>&</a>`)).toBe('&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;&lt;/a&gt;');
  });
});
