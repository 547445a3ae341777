import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as en from '@zxcvbn-ts/language-en';

import { HttpError } from '../http/http-error.ts';

/**
 * zxcvbn's score 0–4 estimates how many guesses a password takes; 3 ("safely unguessable: moderate
 * protection from offline slow-hash attacks", the package's own scale) is the least we accept.
 */
export const MIN_PASSWORD_SCORE = 3;

// Built once: loading the dictionaries takes tens of milliseconds.
let factory: ZxcvbnFactory | null = null;
function strength(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...en.dictionary },
    graphs: common.adjacencyGraphs,
    translations: en.translations,
  });
  return factory;
}

/** Words a guesser tries first for this person: their e-mail and its parts, their name, the product. */
export function contextGuesses(person: { email: string; name: string }): string[] {
  const email = person.email.toLowerCase();
  const [local, domain = ''] = email.split('@');
  const parts = [local, ...local.split(/[._+-]+/), ...domain.split('.'), ...person.name.toLowerCase().split(/\s+/)];
  return [...new Set([email, person.name.toLowerCase(), ...parts, 'holonaut'].filter((w) => w.length >= 3))];
}

/**
 * Refuses a new password that common-password lists, keyboard patterns, repeats or the person's
 * own details would guess (400 naming `field`). Seeded demo accounts do not pass through here.
 */
export function assertStrongPassword(password: string, person: { email: string; name: string }, field = 'password'): void {
  const result = strength().check(password, contextGuesses(person));
  // zxcvbn rates "name + year" as moderate; a password built mostly from the person's own details is
  // the first thing anyone who knows them tries, so half its length from those details is too much.
  const personal = result.sequence
    .filter((m) => m.pattern === 'dictionary' && (m as { dictionaryName?: string }).dictionaryName === 'userInputs')
    .reduce((n, m) => n + m.token.length, 0);
  if (personal * 2 >= password.length) {
    throw new HttpError(400, 'weak_password', 'This password is too easy to guess. It is built from your name or e-mail address: use words that have nothing to do with you.', field);
  }
  if (result.score >= MIN_PASSWORD_SCORE) return;
  const why = result.feedback.warning ? ` ${result.feedback.warning}` : '';
  const hint = result.feedback.suggestions[0] ?? 'Use a few uncommon words together.';
  throw new HttpError(400, 'weak_password', `This password is too easy to guess.${why} ${hint}`.replace(/\s+/g, ' ').trim(), field);
}
