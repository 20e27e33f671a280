import { Pipe, type PipeTransform } from '@angular/core';

const englishPlural = new Intl.PluralRules('en-US');

/** "1 degree of freedom", "3 degrees of freedom", "1,204 studies": the number grouped, the noun by the language's plural rule. */
export function countWords(count: number, one: string, other: string): string {
  return `${count.toLocaleString('en-US')} ${englishPlural.select(count) === 'one' ? one : other}`;
}

/** `{{ df | count: 'degree of freedom' : 'degrees of freedom' }}` in templates. */
@Pipe({ name: 'count' })
export class CountPipe implements PipeTransform {
  transform(count: number, one: string, other: string): string {
    return countWords(count, one, other);
  }
}
