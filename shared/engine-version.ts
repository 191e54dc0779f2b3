/** Version of the measurement engine, stored with every computed result (ISO/IEC 17025:2017 7.11). */
export const ENGINE_VERSION = '1.0.0';
