import { loginSchema } from '@keyloom/shared';
import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Form, FormServerError } from '@/components/ui/form';
import { TextField } from '@/components/ui/text-field';
import { useLogin } from '../api/login';

/**
 * E-mail and password, validated with the shared login schema. On success the session
 * query holds the user, and the sign-in page moves on by itself.
 */
export const SignInForm = () => {
  const login = useLogin();
  const [showPassword, setShowPassword] = useState(false);
  const toggleId = useId();

  return (
    <Form
      schema={loginSchema}
      defaultValues={{ email: '', password: '' }}
      onSubmit={async (values) => {
        await login.mutateAsync(values);
      }}
      aria-label="Sign in"
      errorSummary
    >
      {({ register, formState }) => (
        <>
          <FormServerError message={formState.errors.root?.server?.message} />
          <div className="flex flex-col gap-6">
            <TextField
              label="E-mail address"
              type="email"
              autoComplete="username"
              spellCheck={false}
              registration={register('email')}
              error={formState.errors.email}
            />
            <TextField
              label="Password"
              type={showPassword ? 'text' : 'password'}
              autoComplete="current-password"
              spellCheck={false}
              registration={register('password')}
              error={formState.errors.password}
              after={
                <div className="flex">
                  <label
                    htmlFor={toggleId}
                    className="-ml-1 inline-flex min-h-11 cursor-pointer items-center gap-3 rounded-lg px-1"
                  >
                    <input
                      id={toggleId}
                      type="checkbox"
                      checked={showPassword}
                      onChange={(event) => setShowPassword(event.target.checked)}
                      className="size-6 accent-ink"
                    />
                    Show password
                  </label>
                </div>
              }
            />
            <Button type="submit" variant="primary" disabled={formState.isSubmitting} className="self-start">
              {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
            </Button>
          </div>
        </>
      )}
    </Form>
  );
};
