/** Version of the statistics engine, recorded in every RerunResult (`engine`). */
export const ENGINE_VERSION = '1.0.0';
