import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { User } from "@/types/api";
import type { SignInInput as SignInBody } from "@shared/schemas/auth";

/**
 * The form's own rules, worded for a person at the keyboard; the server checks the same fields again with
 * shared/schemas/auth.ts (whose messages are written for API callers).
 */
export const signInInputSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, "Enter your e-mail address.")
    .pipe(z.email("Enter a full e-mail address, such as name@firm.example.")),
  password: z.string().min(1, "Enter your password."),
});

export type SignInInput = z.infer<typeof signInInputSchema>;

export function signIn(input: SignInBody): Promise<User> {
  // A 401 here means wrong credentials, shown in the form; it must not bounce the page.
  return api.post<User>(apiPaths.auth.signIn, input, { redirectOnUnauthorized: false });
}

export function useSignIn({ onSuccess }: { onSuccess?: (user: User) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // Whatever another account left in the cache must not show to this one.
      queryClient.clear();
      queryClient.setQueryData(queryKeys.me(), user);
      onSuccess?.(user);
    },
  });
}
