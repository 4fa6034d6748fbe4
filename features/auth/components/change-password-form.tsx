import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import { fieldErrorsOf } from '@/features/api/client';
import { useChangePasswordMutation } from '@/features/auth/api/change-password';
import { changePasswordSchema, PASSWORD_MIN } from '@/features/auth/schemas';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';

/**
 * Change one's own password while signed in. The server ends every other session of the account (a
 * phone left signed in at the hall, a shared laptop) and keeps this one, which the notice says.
 */
export function ChangePasswordForm() {
  const change = useChangePasswordMutation();
  return (
    <Formik
      initialValues={{ currentPassword: '', newPassword: '' }}
      validationSchema={() => changePasswordSchema}
      onSubmit={async (values, helpers) => {
        try {
          await change.mutateAsync(values);
          helpers.resetForm();
        } catch (error) {
          helpers.setErrors(fieldErrorsOf(error) ?? {});
        }
      }}
    >
      {({ handleChange, handleBlur, handleSubmit, values, errors, touched, isSubmitting }) => (
        <View style={styles.form}>
          {change.isSuccess ? (
            <Notice testID="password-changed">
              Your password is changed. Every other device where you were signed in is signed out; this one stays signed in.
            </Notice>
          ) : null}
          {change.error && !fieldErrorsOf(change.error) ? <Notice tone="error">{change.error.message}</Notice> : null}
          <TextField
            label="Current password"
            secureTextEntry
            autoComplete="current-password"
            value={values.currentPassword}
            onChangeText={handleChange('currentPassword')}
            onBlur={handleBlur('currentPassword')}
            error={touched.currentPassword && errors.currentPassword}
            testID="current-password"
          />
          <TextField
            label="New password"
            hint={`At least ${PASSWORD_MIN} characters.`}
            secureTextEntry
            autoComplete="new-password"
            value={values.newPassword}
            onChangeText={handleChange('newPassword')}
            onBlur={handleBlur('newPassword')}
            error={touched.newPassword && errors.newPassword}
            testID="new-password"
          />
          <Button label="Change password" busy={isSubmitting} onPress={() => handleSubmit()} testID="change-password" />
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
