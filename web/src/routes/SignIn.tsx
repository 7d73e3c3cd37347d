import { useForm } from "react-hook-form";
import { Navigate, useLocation, useNavigate } from "react-router";
import { ApiError } from "../api/client";
import type { SessionUser } from "../api/types";
import { Button } from "../components/Button";
import { Field, describedBy } from "../components/Field";
import { Notice } from "../components/Notice";
import { TextInput } from "../components/TextInput";
import { useSignInMutation } from "../features/session/mutations";
import { homePathFor } from "../features/session/roles";
import { useSession } from "../features/session/useSession";
import { applyServerFieldError, errorMessage } from "../lib/serverFieldErrors";
import { isReturnPathAllowed } from "../lib/safeReturnPath";
import { setSignInNotice, useSignInNotice } from "../lib/signInNotice";

// The sign-in page is the first load on every tablet, so it checks its two fields with
// react-hook-form's own rules rather than bringing zod in; the server validates with SignInSchema.
interface SignInValues {
  email: string;
  password: string;
}
const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;
const emailRules = {
  validate: (v: string) => (v.trim() === "" ? "Enter your email address." : EMAIL.test(v.trim()) ? true : "Enter a valid email address."),
};
const passwordRules = { required: "Enter your password." };

interface SignInLocationState {
  from?: unknown;
}

/** Words for each refusal the sign-in endpoint can give. */
function signInFailureMessage(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.code === "bad-credentials") {
      return "The email or password is not right. Check both and try again.";
    }
    if (error.code === "account-locked") {
      return "This account is locked after too many failed sign-ins. Ask an administrator to unlock it.";
    }
    if (error.code === "account-inactive") {
      return "This account has been deactivated. Ask an administrator if you still need access.";
    }
  }
  return errorMessage(error);
}

function destinationFor(user: SessionUser, from: unknown): string {
  if (user.mustChangePassword) return "/change-password";
  return isReturnPathAllowed(from, user.roles) ? from : homePathFor(user.roles);
}

/** The sign-in screen. */
export default function SignIn() {
  const navigate = useNavigate();
  const location = useLocation();
  const state = (location.state ?? {}) as SignInLocationState;
  const { user } = useSession();
  const signIn = useSignInMutation();
  const notice = useSignInNotice();

  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SignInValues>();

  if (user && !signIn.isPending) {
    return <Navigate to={destinationFor(user, state.from)} replace />;
  }

  const onSubmit = handleSubmit((values) => {
    signIn.mutate(
      { email: values.email.trim(), password: values.password },
      {
        onSuccess: (session) => {
          setSignInNotice(null);
          if (session.user) navigate(destinationFor(session.user, state.from), { replace: true });
        },
        onError: (error) => {
          applyServerFieldError<SignInValues>(error, ["email", "password"], setError);
        },
      },
    );
  });

  const failureIsOnAField =
    signIn.error instanceof ApiError && signIn.error.code === "invalid-input" && Boolean(signIn.error.field);
  const showFailure = signIn.isError && !failureIsOnAField;

  return (
    <main id="main" className="flex min-h-screen items-start justify-center px-5 py-12 sm:items-center">
      <div className="flex w-full max-w-md flex-col gap-6">
        <div>
          <p className="text-3xl font-bold tracking-wide text-fen-700">Isobatch</p>
          <h1 className="mt-1 text-2xl font-bold">Sign in</h1>
        </div>
        {notice && !signIn.isError && <Notice tone="info">{notice}</Notice>}
        <div aria-live="assertive">
          {showFailure && <Notice tone="error">{signInFailureMessage(signIn.error)}</Notice>}
        </div>
        <form
          onSubmit={onSubmit}
          noValidate
          className="flex flex-col gap-5 rounded-lg border-2 border-ink-200 bg-white p-6"
        >
          <Field id="sign-in-email" label="Email" error={errors.email?.message}>
            <TextInput
              id="sign-in-email"
              type="email"
              autoComplete="username"
              inputMode="email"
              invalid={Boolean(errors.email)}
              aria-describedby={describedBy("sign-in-email", undefined, errors.email?.message)}
              {...register("email", emailRules)}
            />
          </Field>
          <Field id="sign-in-password" label="Password" error={errors.password?.message}>
            <TextInput
              id="sign-in-password"
              type="password"
              autoComplete="current-password"
              invalid={Boolean(errors.password)}
              aria-describedby={describedBy("sign-in-password", undefined, errors.password?.message)}
              {...register("password", passwordRules)}
            />
          </Field>
          <Button type="submit" busy={signIn.isPending} className="w-full">
            Sign in
          </Button>
        </form>
      </div>
    </main>
  );
}
