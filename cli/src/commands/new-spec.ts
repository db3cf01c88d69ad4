// `clino new-spec [file]`: a wizard that writes a commented YAML run spec. The questions and their
// logic live in new-spec/; this file only asks them with inquirer and writes the result.
import { access } from 'node:fs/promises';
import { Command } from 'commander';
import inquirer from 'inquirer';
import { openContext, type CommandDeps } from '../command-context.js';
import { CliError } from '../errors/cli-error.js';
import { renderSpecDraft } from '../new-spec/spec-draft.js';
import { runWizard, type RawAnswers, type WizardQuestion } from '../new-spec/wizard-questions.js';
import { writeFileAtomic } from '../output/atomic-write.js';

async function askWithInquirer(question: WizardQuestion, answers: RawAnswers): Promise<string | boolean> {
  const base = { name: 'answer', message: question.message, default: question.default(answers) };
  const validate = question.validate === undefined ? undefined : (value: string) => question.validate!(String(value), answers);
  const asked = question.type === 'confirm'
    ? await inquirer.prompt<{ answer: boolean }>([{ ...base, type: 'confirm' }])
    : question.type === 'select'
      ? await inquirer.prompt<{ answer: string }>([{ ...base, type: 'select', choices: [...(question.choices ?? [])] }])
      : await inquirer.prompt<{ answer: string }>([{ ...base, type: 'input', validate }]);
  return asked.answer;
}

async function exists(file: string): Promise<boolean> {
  return access(file).then(() => true, () => false);
}

export function newSpecCommand(deps: CommandDeps, ask = askWithInquirer): Command {
  return new Command('new-spec')
    .description('write a new run spec by answering questions (needs a terminal)')
    .argument('[file]', 'where to write it; default <name>.yaml')
    .option('--force', 'overwrite an existing file')
    .action(async (file: string | undefined, options: { force?: boolean }, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      if (!deps.terminal.stdinIsTty && ask === askWithInquirer) {
        throw new CliError('USAGE', 'clino new-spec asks questions and needs a terminal', { hint: 'copy a spec from samples/specs/ instead' });
      }
      const answers = await runWizard(ask);
      const target = file ?? `${answers.name}.yaml`;
      if (options.force !== true && (await exists(target))) {
        throw new CliError('USAGE', `${target} exists already`, { hint: 'choose another file, or add --force' });
      }
      await writeFileAtomic(target, renderSpecDraft(answers));
      context.logger.info({ file: target }, 'spec written; check it with clino check');
      deps.stdout(`${target}\n`);
    });
}
