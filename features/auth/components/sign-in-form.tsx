import { useLocalSearchParams, useRouter } from 'expo-router';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import { fieldErrorsOf } from '@/features/api/client';
import { useSignInMutation } from '@/features/auth/api/sign-in';
import { rememberSignOut, returnPath } from '@/features/auth/return-to';
import { signInSchema, type SignInInput } from '@/features/auth/schemas';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';

export function SignInForm() {
  const router = useRouter();
  // The page that sent the person here (a link in an e-mail), opened once they are signed in.
  const { next } = useLocalSearchParams<{ next?: string }>();
  const signIn = useSignInMutation();
  return (
    <Formik<SignInInput>
      initialValues={{ email: '', password: '' }}
      // A function: yup and the schemas are built at the first validation, not while the page starts.
      validationSchema={() => signInSchema}
      onSubmit={async (values, helpers) => {
        try {
          await signIn.mutateAsync(signInSchema.cast(values));
          rememberSignOut(false);
          router.replace(returnPath(next) as '/');
        } catch (error) {
          const fields = fieldErrorsOf(error);
          if (fields) helpers.setErrors(fields);
        }
      }}
    >
      {({ handleChange, handleBlur, handleSubmit, values, errors, touched, isSubmitting }) => (
        <View style={styles.form}>
          {signIn.error ? (
            <Notice tone="error" testID="sign-in-error">
              {signIn.error.message}
            </Notice>
          ) : null}
          <TextField
            label="E-mail"
            testID="email"
            value={values.email}
            onChangeText={handleChange('email')}
            onBlur={handleBlur('email')}
            autoCapitalize="none"
            autoComplete="email"
            keyboardType="email-address"
            inputMode="email"
            error={touched.email && errors.email}
          />
          <TextField
            label="Password"
            testID="password"
            value={values.password}
            onChangeText={handleChange('password')}
            onBlur={handleBlur('password')}
            secureTextEntry
            autoComplete="current-password"
            onSubmitEditing={() => handleSubmit()}
            error={touched.password && errors.password}
          />
          <Button label="Sign in" testID="sign-in-submit" busy={isSubmitting} onPress={() => handleSubmit()} />
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
