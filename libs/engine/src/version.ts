/** Engine version recorded with every run and lock record; bump when any computed value could change. */
export const ENGINE_VERSION = '0.1.0';
