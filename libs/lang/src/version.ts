/** Version of the Sift language and interpreter (recorded with every run). */
export const LANG_VERSION = '0.1.0';
