/** The `--help` text: the command line's contract with bench automation, kept in one place. */
export const USAGE = `sidecheck - SSB transmitter measurements from I/Q captures and spectrum traces

Usage:
  sidecheck analyze-iq FILE [--sideband usb|lsb|auto] [--full-scale-dbm DBM]
                            [--format sigmf|wav|cf32|ci16] [--rate HZ] [--segment-length N] [--json]
      FILE is a .sigmf-meta (samples in the .sigmf-data beside it), a two-channel WAV (I left,
      Q right; PCM 16-bit or float 32) or a headerless cf32_le/ci16_le file (--format, --rate).
      --full-scale-dbm adds absolute levels (pepDbm, meanPowerDbm) for a calibrated capture.

  sidecheck analyze-trace FILE.csv --mask MASK.json --center-hz HZ --reference-dbm DBM [--json]
      FILE.csv has a header row, e.g. frequency_hz,level_dbm. MASK.json is
      {"reference":"pep","vertices":[[offsetHz, relDb], ...]}: limits relative to the reference
      level, symmetric about the centre. worstMarginDb = min(limit - level); negative = over.

  sidecheck synthesize --out PREFIX [--rate HZ] [--duration S] [--tone HZ:DBFS]... [options]
      Writes PREFIX.sigmf-meta and PREFIX.sigmf-data with a reference SSB signal of known truth.
      Run "sidecheck synthesize --help" for the signal options.

  sidecheck self-validate [--json]
      Runs the engine on synthesized signals with known values and reports expected vs measured
      (software validation, ISO/IEC 17025:2017 7.11.2). Exit 1 if any case fails.

  sidecheck --help | COMMAND --help

Output: with --json one JSON object on stdout; otherwise a readable table.
Errors: one line on stderr; exit 2 for a wrong command line, 1 for bad input or a failed check.
`;
