import { useMutation } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";

/** Asks for a reset link; the answer is the same whether or not the address has an account. */
export function requestPasswordReset(body: { email: string }): Promise<{ message: string }> {
  return api.post(apiPaths.passwordReset.request, body, { redirectOnUnauthorized: false });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
