import * as Yup from 'yup';
import { bookingDays } from './bookings';

/**
 * Yup rules for whole days `startsOn`–`endsOn`, both included, at most
 * `maxDays` long; `first` and `last` ask for a missing day, `what` names the range ("A rental").
 */
export function dayRangeRules(words: { first: string; last: string; what: string }, maxDays: number) {
  return {
    startsOn: Yup.string().required(words.first),
    endsOn: Yup.string()
      .required(words.last)
      .test('after-start', 'The last day cannot be before the first.', function (value) {
        const startsOn = (this.parent as { startsOn?: string }).startsOn;
        return !value || !startsOn || value >= startsOn;
      })
      .test('not-too-long', `${words.what} may span at most ${maxDays} days.`, function (value) {
        const startsOn = (this.parent as { startsOn?: string }).startsOn;
        return !value || !startsOn || value < startsOn || bookingDays(startsOn, value) <= maxDays;
      }),
  };
}
