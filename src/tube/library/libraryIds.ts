/**
 * The built-in tubes' names, without their records, in the chooser's order:
 * for checks that need the names only (the worker that reads a user's tubes
 * file refuses library names without carrying the library's records). Kept
 * equal to tubeLibrary's ids by a test.
 */
export const LIBRARY_TUBE_IDS: readonly string[] = ['12AX7', '12AT7', '12AU7', '12AY7', '12BH7', '6SN7', '6CG7', '6SL7', '6DJ8', '6922', '5687', '6N1P', '300B', '2A3', '45', 'EL84-T', 'EL34-T', '6V6-T'];
