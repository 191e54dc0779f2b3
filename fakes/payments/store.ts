import {
  closeSync,
  fsyncSync,
  mkdirSync,
  openSync,
  readFileSync,
  renameSync,
  writeSync,
} from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { emptyPaymentsState, type PaymentsState } from './payments-state';

/** File name of the state document inside the data folder. */
export const STATE_FILE_NAME = 'payments-state.json';

/**
 * The stand-in's state in memory, persisted to `<dataDir>/payments-state.json`.
 *
 * Writes are synchronous and atomic (write a temporary file, fsync, rename over the old one), so
 * a response is only sent once its change is on disk and a crash never leaves a torn file.
 * Synchronous is fine at a stand-in's load and keeps every handler free of interleavings.
 */
export class PaymentsStore {
  private constructor(
    private readonly filePath: string,
    public state: PaymentsState,
  ) {}

  /**
   * Opens the state in a data folder (created if needed); empty when there is no file yet.
   * @throws Error naming the file when it exists but is not a state document.
   */
  static open(dataDir: string): PaymentsStore {
    mkdirSync(dataDir, { recursive: true });
    const filePath = join(dataDir, STATE_FILE_NAME);
    let text: string;
    try {
      text = readFileSync(filePath, 'utf8');
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') {
        return new PaymentsStore(filePath, emptyPaymentsState());
      }
      throw error;
    }
    const parsed = JSON.parse(text) as PaymentsState;
    if (parsed?.version !== 1)
      throw new Error(`PaymentsStore.open: ${filePath} is not a version 1 state file`);
    return new PaymentsStore(filePath, { ...emptyPaymentsState(), ...parsed });
  }

  /**
   * Runs a change against the state and persists it before returning the change's result.
   * @example store.mutate((state) => { state.customers[c.id] = c; return c; })
   */
  mutate<T>(change: (state: PaymentsState) => T): T {
    const result = change(this.state);
    this.save();
    return result;
  }

  /** Forgets everything (the test-control reset) and persists the empty state. */
  reset(): void {
    this.state = emptyPaymentsState();
    this.save();
  }

  private save(): void {
    const temporary = `${this.filePath}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`;
    const descriptor = openSync(temporary, 'w');
    try {
      writeSync(descriptor, JSON.stringify(this.state));
      fsyncSync(descriptor);
    } finally {
      closeSync(descriptor);
    }
    renameSync(temporary, this.filePath);
  }
}
