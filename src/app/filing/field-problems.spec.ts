import { controlForField, firstProblemStep, placeFieldProblems, stepOfField } from './field-problems';
import { createFilingForm, reportedForm } from './filing-form';

describe('field problems', () => {
  it('puts each API key on its step', () => {
    expect(stepOfField('title')).toBe(0);
    expect(stepOfField('departmentId')).toBe(0);
    expect(stepOfField('plan.outcome')).toBe(1);
    expect(stepOfField('plan.comparisons.1')).toBe(1);
    expect(stepOfField('samplingNotes')).toBe(1);
    expect(stepOfField('dataset')).toBe(2);
    expect(stepOfField('reported.3')).toBe(3);
    expect(stepOfField('version')).toBe(4);
    expect(firstProblemStep({ 'reported.0': 'x', 'plan.between': 'y' })).toBe(1);
    expect(firstProblemStep({})).toBe(-1);
  });

  it('finds the control for field keys and marks it with the server message', () => {
    const form = createFilingForm();
    form.controls.reported.push(reportedForm(''));
    form.controls.reported.push(reportedForm('F(2, 87) = 4.10'));
    expect(controlForField(form, 'plan.outcome')).toBe(form.controls.design.controls.outcome);
    expect(controlForField(form, 'plan.between')).toBeNull();
    // Saved reported results skip empty lines, so "reported.0" is the second line on screen.
    expect(controlForField(form, 'reported.0')).toBe(form.controls.reported.at(1).controls.text);
    const unplaced = placeFieldProblems(form, { title: 'Title is required', 'plan.between': 'Two groups need one grouping column.' });
    expect(form.controls.purpose.controls.title.getError('server')).toBe('Title is required');
    expect(form.controls.purpose.controls.title.touched).toBe(true);
    expect(unplaced).toEqual(['plan.between']);
  });
});
