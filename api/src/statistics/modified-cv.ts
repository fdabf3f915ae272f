/**
 * The modified coefficient of variation method (CMH-17-1G Vol. 1 chapter 8):
 * data from a qualification programme often show less scatter than the
 * material will in service, so a floor is put under the CV:
 *
 *   CV* = 6 %            when CV < 4 %
 *   CV* = CV/2 + 4 %     when 4 % <= CV < 8 %
 *   CV* = CV             otherwise
 *
 * and each group's values are stretched about their mean, x' = C (x - x̄) + x̄
 * with C = CV* / CV, so that the transformed group has CV* exactly. CVs are
 * fractions here (0.04 = 4 %).
 */
import { describe } from './descriptive.ts';

/** CV* from a CV (both fractions). */
export function modifiedCv(cv: number): number {
  if (cv < 0.04) return 0.06;
  if (cv < 0.08) return cv / 2 + 0.04;
  return cv;
}

/**
 * Values stretched about `centre` by the factor that takes `cv` to CV*.
 * `cv` is the CV the factor is based on (the group's, or the condition's when
 * the stretching is about batch means for the k-sample test).
 */
export function stretchToModifiedCv(values: readonly number[], centre: number, cv: number): number[] {
  if (!(cv > 0)) return [...values];
  const factor = modifiedCv(cv) / cv;
  return values.map((x) => factor * (x - centre) + centre);
}

/** The group mean and CV, then the group stretched to CV* about its own mean. */
export function transformGroupToModifiedCv(values: readonly number[]): { values: number[]; cv: number; cvStar: number } {
  const { mean, cv } = describe(values);
  const groupCv = cv ?? 0;
  return { values: stretchToModifiedCv(values, mean ?? 0, groupCv), cv: groupCv, cvStar: modifiedCv(groupCv) };
}
