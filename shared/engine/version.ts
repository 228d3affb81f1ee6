/** Version of the stability engine, written into every result so stored sweeps say which solver made them. */
export const ENGINE_VERSION = "1.1.0";
