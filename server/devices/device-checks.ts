import { Client } from '../db/models';
import { validationFailed } from '../http/problem';
import type { CreateDeviceBody } from '../../shared/schemas/records';
import { parseEmissionDesignator } from '../../shared/bandwidth/emission-designator';

/**
 * What the schema cannot say about a device record, for registering and for editing one: a
 * frequency range that is not upside down, an emission designator that parses (ITU Radio
 * Regulations Appendix 1), and a client of this lab. Throws the 422 with the field at fault.
 */
export async function checkDevice(b: CreateDeviceBody): Promise<void> {
  if (b.frequencyMaxHz < b.frequencyMinHz) {
    throw validationFailed('The highest frequency is below the lowest.', [{ pointer: '/frequencyMaxHz', message: 'must be at least the lowest frequency' }]);
  }
  try {
    parseEmissionDesignator(b.emissionDesignator);
  } catch (error) {
    throw validationFailed(`The emission designator is not valid: ${(error as Error).message}`, [{ pointer: '/emissionDesignator', message: 'is not a valid designator such as 2K70J3E' }]);
  }
  if (!(await Client.findByPk(b.clientId))) {
    throw validationFailed('The client does not exist.', [{ pointer: '/clientId', message: 'is not one of your clients' }]);
  }
}
