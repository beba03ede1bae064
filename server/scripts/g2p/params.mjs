// Parameters of the committed pronunciation model (recorded in the model file and its checksum).
/** The parameters of the committed model, chosen on the development tenth. */
export const PARAMS = {
  split: 'FNV-1a 32 of spelling mod 10: 0 held out, 1 development, rest training',
  // Graphone shapes [letters, phones]: every graphone reads at least one letter.
  shapes: [[1, 0], [1, 1], [1, 2]],
  emIterations: 6,
  order: 7,
  // Least occurrences kept per n-gram order 1..7.
  cutoffs: [1, 1, 1, 1, 1, 2, 2],
};

