/** Leadline's version, shared by the command line, the server and the web site. Kept equal to the package versions. */
export const LEADLINE_VERSION = '0.1.0';
