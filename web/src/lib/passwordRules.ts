import { z } from "zod";

/** The API's minimum password length, for new and temporary passwords alike. */
export const MIN_PASSWORD_LENGTH = 12;

/** A password field that meets the length rule. */
export const passwordSchema = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`);
