import bcrypt from 'bcryptjs';

/** bcrypt cost; 10 is the floor the team agreed on (docs/architecture.md, Auth). */
export const BCRYPT_COST = 11;

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_COST);
export const checkPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

/**
 * A hash to compare against when the e-mail is unknown, so an unknown user
 * costs the same time as a wrong password and the answers cannot be told apart.
 */
export const DECOY_HASH = bcrypt.hashSync('decoy-password-for-timing', BCRYPT_COST);
