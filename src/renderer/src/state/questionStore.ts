/**
 * Questions the app must ask before it goes on (unsaved changes, a recovery copy): one at a time,
 * answered in the app's own dialog, each answer a promise. Commands ask; the DialogHost shows.
 */
import { createStore, type Store } from './store';

export interface Choice<C extends string = string> {
  id: C;
  label: string;
  /** The default button (Enter). */
  primary?: boolean;
}

export interface Question<C extends string = string> {
  title: string;
  body: string;
  choices: Choice<C>[];
  /** The answer when the dialog is dismissed (Escape). */
  dismiss: C;
}

interface Asked {
  question: Question;
  answer: (choice: string) => void;
}

export interface QuestionStore extends Store<Asked | null> {
  ask<C extends string>(question: Question<C>): Promise<C>;
}

export function createQuestionStore(): QuestionStore {
  const store = createStore<Asked | null>(null);
  const queue: Asked[] = [];
  const showNext = (): void => store.set(queue[0] ?? null);
  return {
    ...store,
    ask<C extends string>(question: Question<C>) {
      return new Promise<C>((resolve) => {
        queue.push({
          question,
          answer: (choice) => {
            queue.shift();
            showNext();
            resolve(choice as C);
          },
        });
        if (queue.length === 1) showNext();
      });
    },
  };
}
