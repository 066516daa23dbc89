import bcrypt from 'bcryptjs';

const COST = 10;

export const hashPassword = (password: string) => bcrypt.hash(password, COST);
export const checkPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

/** Compared against when the e-mail is unknown, so a wrong address takes as long as a wrong password. */
export const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', COST);
