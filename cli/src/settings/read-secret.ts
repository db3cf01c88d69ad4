// Reads a secret (a machine token): with inquirer's password prompt on a terminal, else the first
// line of stdin, so `printf '%s\n' "$TOKEN" | clino login URL` works in scripts.
import inquirer from 'inquirer';
import { CliError } from '../errors/cli-error.js';

export async function firstLineOf(stream: NodeJS.ReadableStream): Promise<string> {
  let text = '';
  for await (const chunk of stream) {
    text += typeof chunk === 'string' ? chunk : Buffer.from(chunk as Uint8Array).toString('utf8');
    if (text.includes('\n')) break;
  }
  return (text.split(/\r?\n/)[0] ?? '').trim();
}

export async function readSecret(message: string, stdin: NodeJS.ReadableStream, interactive: boolean): Promise<string> {
  const value = interactive
    ? String((await inquirer.prompt<{ secret: string }>([{ type: 'password', name: 'secret', message, mask: '*' }])).secret).trim()
    : await firstLineOf(stdin);
  if (value === '') throw new CliError('USAGE', 'no machine token was given', { hint: 'paste the token an admin created for this machine' });
  return value;
}
