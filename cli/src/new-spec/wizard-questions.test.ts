// The new-spec wizard without a terminal: its questions answered by a script that follows the same
// rules as inquirer (when, default, validate), and the YAML it writes read back by the spec loader.
import { describe, expect, it } from 'vitest';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import { renderSpecDraft } from './spec-draft.js';
import { runWizard, WIZARD_QUESTIONS, type RawAnswers, type WizardQuestion } from './wizard-questions.js';

/** Answers from the script, else the question's default; every answer must pass validation. */
function scripted(script: RawAnswers, asked: string[] = []) {
  return async (question: WizardQuestion, answers: RawAnswers): Promise<string | boolean> => {
    asked.push(question.name);
    const value = script[question.name] ?? question.default(answers);
    const verdict = question.validate?.(String(value), answers) ?? true;
    if (verdict !== true) throw new Error(`${question.name}: ${verdict}`);
    return value;
  };
}

const question = (name: string): WizardQuestion => WIZARD_QUESTIONS.find((q) => q.name === name)!;

describe('the new-spec wizard', () => {
  it('writes a spec the loader accepts from the defaults alone, with comments', async () => {
    const text = renderSpecDraft(await runWizard(scripted({})));
    const { spec } = loadRunSpec(text, 'draft.yaml');
    expect(spec.name).toBe('core-monthly');
    expect(spec.estimation.adjustment).toBe('blume');
    expect(text).toContain('# Format version of the run spec; always 1.');
  });

  it('offers the frequency\'s default window and minimum (DESIGN.md: weekly 156/104)', async () => {
    const asked: string[] = [];
    const answers = await runWizard(scripted({ frequency: 'weekly' }, asked));
    expect([answers.window, answers.minimum]).toEqual([156, 104]);
  });

  it('asks for Dimson lags only when the estimator is dimson, and writes them', async () => {
    const withOls: string[] = [];
    await runWizard(scripted({}, withOls));
    expect(withOls).not.toContain('dimsonLags');
    const answers = await runWizard(scripted({ estimator: 'dimson', dimsonLags: '2' }));
    expect(loadRunSpec(renderSpecDraft(answers), 'd.yaml').spec.estimation.dimson.lags).toBe(2);
  });

  it('writes a constant risk-free yield without a file pattern when asked for one', async () => {
    const asked: string[] = [];
    const answers = await runWizard(scripted({ riskFreeSource: 'constant', riskFreeConstant: '0.025' }, asked));
    expect(asked).not.toContain('riskFreePattern');
    expect(loadRunSpec(renderSpecDraft(answers), 'c.yaml').spec.inputs.riskFree).toEqual({ source: 'constant', annualYield: 0.025 });
  });

  it('refuses a name that is not a slug, a minimum above the window and a rate written in percent', () => {
    expect(question('name').validate!('Core Monthly', {})).toContain('is not allowed');
    expect(question('minimum').validate!('70', { window: '60' })).toBe('70 is more than the window (60); allowed: at most the window');
    expect(question('pricingMarketPremium').validate!('5.5', {})).toContain('a decimal from -1 to 1');
    expect(question('pricingMarketPremium').validate!('0.055', {})).toBe(true);
  });
});
