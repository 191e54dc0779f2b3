import type { Transaction } from 'sequelize';
import { User } from '../db/models';

/** The account with this e-mail address, compared without case (as the unique index on users is). */
export async function findUserByEmail(email: string, transaction?: Transaction | null): Promise<User | null> {
  const sequelize = User.sequelize!;
  return User.findOne({
    where: sequelize.where(sequelize.fn('lower', sequelize.col('email')), email.toLowerCase()),
    transaction: transaction ?? undefined,
  });
}
