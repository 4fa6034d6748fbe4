import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import { fieldErrorsOf } from '@/features/api/client';
import { useRequestResetMutation } from '@/features/auth/api/request-reset';
import { requestResetSchema } from '@/features/auth/schemas';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';

export function ForgotPasswordForm() {
  const request = useRequestResetMutation();
  if (request.isSuccess) {
    return <Notice>If an account uses that address, an e-mail with a reset link is on its way. The link works for one hour.</Notice>;
  }
  return (
    <Formik
      initialValues={{ email: '' }}
      // A function: yup and the schemas are built at the first validation, not while the page starts.
      validationSchema={() => requestResetSchema}
      onSubmit={async (values, helpers) => {
        try {
          await request.mutateAsync(requestResetSchema.cast(values));
        } catch (error) {
          helpers.setErrors(fieldErrorsOf(error) ?? {});
        }
      }}
    >
      {({ handleChange, handleBlur, handleSubmit, values, errors, touched, isSubmitting }) => (
        <View style={styles.form}>
          {request.error ? <Notice tone="error">{request.error.message}</Notice> : null}
          <TextField
            label="E-mail"
            value={values.email}
            onChangeText={handleChange('email')}
            onBlur={handleBlur('email')}
            autoCapitalize="none"
            inputMode="email"
            error={touched.email && errors.email}
          />
          <Button label="Send reset link" busy={isSubmitting} onPress={() => handleSubmit()} />
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
