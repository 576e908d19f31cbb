import { listSelection, markdownLiteToHtml, wrapSelection } from './markdown-lite';

describe('markdownLiteToHtml', () => {
  it('turns emphasis, lists, links and paragraphs into HTML', () => {
    const html = markdownLiteToHtml('Please add **Welch** and *Games–Howell*.\n\n- report df\n- report CI\n\nSee [the plan](https://oie.example.edu/plan?a=1&b=2).');
    expect(html).toBe(
      '<p>Please add <strong>Welch</strong> and <em>Games–Howell</em>.</p>' +
        '<ul><li>report df</li><li>report CI</li></ul>' +
        '<p>See <a href="https://oie.example.edu/plan?a=1&amp;b=2" rel="noopener noreferrer">the plan</a>.</p>',
    );
  });

  it('escapes markup and refuses script links', () => {
    const html = markdownLiteToHtml('<script>alert(1)</script> [x](javascript:alert(1))');
    expect(html).not.toContain('<script>');
    expect(html).toContain('&lt;script&gt;');
    expect(html).not.toContain('href="javascript');
  });

  it('keeps single line breaks inside a paragraph', () => {
    expect(markdownLiteToHtml('one\ntwo')).toBe('<p>one<br>two</p>');
  });
});

describe('composer helpers', () => {
  it('wraps the selection and keeps it selected', () => {
    expect(wrapSelection('make this bold', 5, 9, '**')).toEqual({ value: 'make **this** bold', start: 7, end: 11 });
  });
  it('turns selected lines into list items', () => {
    expect(listSelection('a\nb\nc', 2, 5).value).toBe('a\n- b\n- c');
  });
});
