import { useRouter } from 'expo-router';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import { fieldErrorsOf } from '@/features/api/client';
import { useResetPasswordMutation } from '@/features/auth/api/reset-password';
import { PASSWORD_MIN, resetPasswordSchema } from '@/features/auth/schemas';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const reset = useResetPasswordMutation();
  if (reset.isSuccess) {
    return (
      <View style={styles.form}>
        <Notice>Your password is changed. Sign in with the new one.</Notice>
        <Button label="Go to sign-in" onPress={() => router.replace('/sign-in')} />
      </View>
    );
  }
  return (
    <Formik
      initialValues={{ token, password: '' }}
      // A function: yup and the schemas are built at the first validation, not while the page starts.
      validationSchema={() => resetPasswordSchema}
      onSubmit={async (values, helpers) => {
        try {
          await reset.mutateAsync(values);
        } catch (error) {
          helpers.setErrors(fieldErrorsOf(error) ?? {});
        }
      }}
    >
      {({ handleChange, handleBlur, handleSubmit, values, errors, touched, isSubmitting }) => (
        <View style={styles.form}>
          {reset.error ? <Notice tone="error">{reset.error.message}</Notice> : null}
          <TextField
            label="New password"
            hint={`At least ${PASSWORD_MIN} characters.`}
            secureTextEntry
            autoComplete="new-password"
            value={values.password}
            onChangeText={handleChange('password')}
            onBlur={handleBlur('password')}
            error={touched.password && errors.password}
          />
          <Button label="Save new password" busy={isSubmitting} onPress={() => handleSubmit()} />
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
