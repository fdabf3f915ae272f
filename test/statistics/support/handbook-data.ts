/**
 * Published example data sets used as worked checks. Numbers are data from
 * the sources named, not invented demo data:
 *
 * - CMH-17-1G Vol. 1, section 8.3.11.1.1 (single-condition examples, by
 *   condition and batch) and 8.3.11.1.2 (pooling across conditions), as
 *   reproduced in the validation vignette of the R package cmstatr
 *   (Kloppenborg 2020, vignettes/cmstatr_Validation), with the results of the
 *   programs STAT-17, ASAP 2008 and CMH17-STATS quoted there.
 * - An 18-value data set with STAT-17 results, and 61-value and 28-value
 *   sets, from the same vignette.
 * - Scholz & Stephens (1987), J. Am. Stat. Assoc. 82:918, the smoothness
 *   data of four laboratories (their Table 2 example).
 */

/** [batch, strength, condition] rows of CMH-17-1G 8.3.11.1.1. */
const ROWS_8_3_11_1_1: [number, number, string][] = [
  [1, 118.3774604, 'CTD'], [1, 123.6035612, 'CTD'], [1, 115.2238092, 'CTD'], [1, 112.6379744, 'CTD'], [1, 116.5564277, 'CTD'], [1, 123.1649896, 'CTD'],
  [2, 128.5589027, 'CTD'], [2, 113.1462103, 'CTD'], [2, 121.4248107, 'CTD'], [2, 134.3241906, 'CTD'], [2, 129.6405117, 'CTD'], [2, 117.9818658, 'CTD'],
  [3, 115.4505226, 'CTD'], [3, 120.0369467, 'CTD'], [3, 117.1631088, 'CTD'], [3, 112.9302797, 'CTD'], [3, 117.9114501, 'CTD'], [3, 120.1900159, 'CTD'], [3, 110.7295966, 'CTD'],
  [1, 84.9581364, 'RTD'], [1, 92.4891822, 'RTD'], [1, 96.8212659, 'RTD'], [1, 109.030325, 'RTD'], [1, 97.8212659, 'RTD'], [1, 100.921519, 'RTD'], [1, 103.699444, 'RTD'],
  [2, 93.7908212, 'RTD'], [2, 107.526709, 'RTD'], [2, 94.5769704, 'RTD'], [2, 93.8831373, 'RTD'], [2, 98.2296605, 'RTD'], [2, 111.34659, 'RTD'], [2, 100.817538, 'RTD'],
  [3, 100.382203, 'RTD'], [3, 91.5037811, 'RTD'], [3, 100.083233, 'RTD'], [3, 95.6393615, 'RTD'], [3, 109.304779, 'RTD'], [3, 100.078562, 'RTD'], [3, 99.1205847, 'RTD'],
  [1, 83.7436035, 'ETD'], [1, 84.3831677, 'ETD'], [1, 94.8030433, 'ETD'], [1, 94.3931537, 'ETD'], [1, 101.702222, 'ETD'], [1, 86.5372121, 'ETD'], [1, 92.3772684, 'ETD'],
  [2, 89.2084024, 'ETD'], [2, 100.686001, 'ETD'], [2, 81.0444192, 'ETD'], [2, 91.339807, 'ETD'], [2, 93.1441939, 'ETD'], [2, 85.8204168, 'ETD'],
  [3, 94.8966273, 'ETD'], [3, 95.806852, 'ETD'], [3, 86.7842252, 'ETD'], [3, 94.4011973, 'ETD'], [3, 96.7231171, 'ETD'], [3, 89.9010384, 'ETD'], [3, 89.3672306, 'ETD'],
  [1, 106.357525, 'ETW'], [1, 105.898733, 'ETW'], [1, 88.4640082, 'ETW'], [1, 103.901744, 'ETW'], [1, 80.2058219, 'ETW'], [1, 109.199597, 'ETW'], [1, 61.0139431, 'ETW'],
  [2, 99.3207107, 'ETW'], [2, 115.86177, 'ETW'], [2, 82.6133082, 'ETW'], [2, 85.3690411, 'ETW'], [2, 115.801622, 'ETW'], [2, 44.3217741, 'ETW'], [2, 117.328077, 'ETW'], [2, 88.6782903, 'ETW'],
  [3, 107.676986, 'ETW'], [3, 108.960241, 'ETW'], [3, 116.12264, 'ETW'], [3, 80.2334815, 'ETW'], [3, 106.14557, 'ETW'], [3, 104.667866, 'ETW'], [3, 104.234953, 'ETW'],
  [1, 99.0239966, 'ETW2'], [1, 103.341238, 'ETW2'], [1, 100.30213, 'ETW2'], [1, 98.4634133, 'ETW2'], [1, 92.264728, 'ETW2'], [1, 103.487693, 'ETW2'], [1, 113.734763, 'ETW2'],
  [2, 108.172659, 'ETW2'], [2, 108.426732, 'ETW2'], [2, 116.260375, 'ETW2'], [2, 121.04961, 'ETW2'], [2, 111.223082, 'ETW2'], [2, 104.574843, 'ETW2'], [2, 103.222552, 'ETW2'],
  [3, 99.3918538, 'ETW2'], [3, 87.3421658, 'ETW2'], [3, 102.730741, 'ETW2'], [3, 96.3694916, 'ETW2'], [3, 99.5946088, 'ETW2'], [3, 97.0712407, 'ETW2'],
];

/** [batch, strength, condition] rows of CMH-17-1G 8.3.11.1.2 (the pooling example). */
const ROWS_8_3_11_1_2: [number, number, string][] = [
  [1, 79.04517, 'CTD'], [1, 102.6014, 'CTD'], [1, 97.79372, 'CTD'], [1, 92.86423, 'CTD'], [1, 117.218, 'CTD'], [1, 108.7168, 'CTD'], [1, 112.2773, 'CTD'], [1, 114.0129, 'CTD'],
  [2, 106.8452, 'CTD'], [2, 112.3911, 'CTD'], [2, 115.5658, 'CTD'], [2, 87.40657, 'CTD'], [2, 102.2785, 'CTD'], [2, 110.6073, 'CTD'],
  [3, 105.2762, 'CTD'], [3, 110.8924, 'CTD'], [3, 108.7638, 'CTD'], [3, 110.9833, 'CTD'], [3, 101.3417, 'CTD'], [3, 100.0251, 'CTD'],
  [1, 103.2006, 'RTD'], [1, 105.1034, 'RTD'], [1, 105.1893, 'RTD'], [1, 100.4189, 'RTD'],
  [2, 85.32319, 'RTD'], [2, 92.69923, 'RTD'], [2, 98.45242, 'RTD'], [2, 104.1014, 'RTD'], [2, 91.51841, 'RTD'], [2, 101.3746, 'RTD'], [2, 101.5828, 'RTD'], [2, 99.57384, 'RTD'], [2, 88.84826, 'RTD'],
  [3, 92.18703, 'RTD'], [3, 101.8234, 'RTD'], [3, 97.68909, 'RTD'], [3, 101.5172, 'RTD'], [3, 100.0481, 'RTD'], [3, 102.0544, 'RTD'],
  [1, 63.22764, 'ETW'], [1, 70.84454, 'ETW'], [1, 66.43223, 'ETW'], [1, 75.37771, 'ETW'], [1, 72.43773, 'ETW'], [1, 68.43073, 'ETW'], [1, 69.72524, 'ETW'],
  [2, 66.20343, 'ETW'], [2, 60.51251, 'ETW'], [2, 65.69334, 'ETW'], [2, 62.73595, 'ETW'], [2, 59.00798, 'ETW'], [2, 62.37761, 'ETW'],
  [3, 64.3947, 'ETW'], [3, 72.8491, 'ETW'], [3, 66.56226, 'ETW'], [3, 66.56779, 'ETW'], [3, 66.00123, 'ETW'], [3, 59.62108, 'ETW'], [3, 60.61167, 'ETW'], [3, 57.65487, 'ETW'],
  [3, 66.51241, 'ETW'], [3, 64.89347, 'ETW'], [3, 57.73054, 'ETW'], [3, 68.94086, 'ETW'], [3, 61.63177, 'ETW'],
  [1, 54.09806, 'ETW2'], [1, 58.87615, 'ETW2'], [1, 61.60167, 'ETW2'], [1, 60.23973, 'ETW2'], [1, 61.4808, 'ETW2'], [1, 64.55832, 'ETW2'],
  [2, 57.76131, 'ETW2'], [2, 49.91463, 'ETW2'], [2, 61.49271, 'ETW2'], [2, 57.7281, 'ETW2'], [2, 62.11653, 'ETW2'], [2, 62.69353, 'ETW2'],
  [3, 61.38523, 'ETW2'], [3, 60.39053, 'ETW2'], [3, 59.17616, 'ETW2'], [3, 60.17616, 'ETW2'], [3, 46.47396, 'ETW2'], [3, 51.16616, 'ETW2'],
];

export interface ExampleSet {
  values: number[];
  batches: string[];
  conditions: string[];
}

function toSet(rows: [number, number, string][], keep: (condition: string) => boolean = () => true): ExampleSet {
  const kept = rows.filter((r) => keep(r[2]));
  return { values: kept.map((r) => r[1]), batches: kept.map((r) => String(r[0])), conditions: kept.map((r) => r[2]) };
}

/** CMH-17-1G 8.3.11.1.1, optionally one condition only. */
export function example8_3_11_1_1(condition?: string): ExampleSet {
  return toSet(ROWS_8_3_11_1_1, (c) => condition === undefined || c === condition);
}

/** CMH-17-1G 8.3.11.1.2, optionally without some conditions. */
export function example8_3_11_1_2(without: string[] = []): ExampleSet {
  return toSet(ROWS_8_3_11_1_2, (c) => !without.includes(c));
}

/** The values of one batch of one condition of 8.3.11.1.1. */
export function batchOf8_3_11_1_1(condition: string, batch: number): number[] {
  return ROWS_8_3_11_1_1.filter((r) => r[2] === condition && r[0] === batch).map((r) => r[1]);
}

/** 18 values with STAT-17 results (cmstatr validation vignette, sections 5.3 to 5.8). */
export const STAT17_18_VALUES = [
  137.4438, 139.5395, 150.89, 141.4474, 141.8203, 151.8821, 143.9245, 132.9732, 136.6419, 138.1723, 148.7668, 143.283, 143.5429, 141.7023, 137.4732,
  152.338, 144.1589, 128.5218,
];

/** 61 values for the nonparametric large-sample B-basis (cmstatr validation vignette, section 5.9). */
export const LARGE_SAMPLE_61_VALUES = [
  137.3603, 135.6665, 136.6914, 154.7919, 159.2037, 137.3277, 128.821, 138.6304, 138.9004, 147.4598, 148.6622, 144.4948, 131.0851, 149.0203, 131.8232,
  146.4471, 123.8124, 126.3105, 140.7609, 134.4875, 128.7508, 117.1854, 129.3088, 141.6789, 138.4073, 136.0295, 128.4164, 141.7733, 134.455, 122.7383,
  136.9171, 136.9232, 138.8402, 152.8294, 135.0633, 121.052, 131.035, 138.3248, 131.1379, 147.3771, 130.0681, 132.7467, 137.1444, 141.662, 146.9363,
  160.7448, 138.5511, 129.1628, 140.2939, 144.8167, 156.5918, 132.0099, 129.3551, 136.6066, 134.5095, 128.2081, 144.0896, 141.8029, 130.0149, 140.8813,
  137.7864,
];

/** Scholz & Stephens (1987) smoothness of paper measured by four laboratories, eight values each. */
export const SCHOLZ_STEPHENS_SMOOTHNESS = [
  [38.7, 41.5, 43.8, 44.5, 45.5, 46.0, 47.7, 58.0],
  [39.2, 39.3, 39.7, 41.4, 41.8, 42.9, 43.3, 45.8],
  [34.0, 35.0, 39.0, 40.0, 43.0, 43.0, 44.0, 45.0],
  [34.0, 34.8, 34.8, 35.4, 37.2, 37.8, 41.2, 42.8],
];
