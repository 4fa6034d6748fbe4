import { useRouter } from 'expo-router';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import { ApiError, fieldErrorsOf } from '@/features/api/client';
import { useAcceptInvitationMutation } from '@/features/auth/api/accept-invitation';
import { useInvitationQuery } from '@/features/auth/api/get-invitation';
import { acceptInvitationSchema, PASSWORD_MIN, ROLE_LABELS, type RoleValue } from '@/features/auth/schemas';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { space } from '@/features/ui/theme';

export function AcceptInvitationForm({ token }: { token: string }) {
  const router = useRouter();
  const invitation = useInvitationQuery(token);
  const accept = useAcceptInvitationMutation();
  if (invitation.isPending) return <Text>Checking your invitation…</Text>;
  if (invitation.error) return <Notice tone="error">{invitation.error.message}</Notice>;
  const { email, clubName, role, hasAccount, children = [] } = invitation.data;
  return (
    <Formik
      initialValues={{ token, displayName: hasAccount ? 'existing account' : '', password: '' }}
      // A function: yup and the schemas are built at the first validation, not while the page starts.
      validationSchema={() => acceptInvitationSchema}
      onSubmit={async (values, helpers) => {
        try {
          await accept.mutateAsync(values);
          router.replace('/');
        } catch (error) {
          helpers.setErrors(fieldErrorsOf(error) ?? {});
        }
      }}
    >
      {({ handleChange, handleBlur, handleSubmit, values, errors, touched, isSubmitting }) => (
        <View style={styles.form}>
          <Notice>
            {children.length > 0
              ? `${clubName} invites ${email} to follow ${children.join(' and ')} as their parent or guardian.`
              : `${clubName} invites ${email} to join as ${ROLE_LABELS[role as RoleValue] ?? role}.`}
          </Notice>
          {accept.error && !(accept.error instanceof ApiError && accept.error.fields) ? <Notice tone="error">{accept.error.message}</Notice> : null}
          {hasAccount ? null : (
            <TextField
              label="Your name"
              value={values.displayName}
              onChangeText={handleChange('displayName')}
              onBlur={handleBlur('displayName')}
              autoComplete="name"
              error={touched.displayName && errors.displayName}
            />
          )}
          <TextField
            label={hasAccount ? 'Your existing password' : 'Choose a password'}
            hint={hasAccount ? undefined : `At least ${PASSWORD_MIN} characters.`}
            secureTextEntry
            autoComplete={hasAccount ? 'current-password' : 'new-password'}
            value={values.password}
            onChangeText={handleChange('password')}
            onBlur={handleBlur('password')}
            error={touched.password && errors.password}
          />
          <Button label="Join the club" busy={isSubmitting} onPress={() => handleSubmit()} />
        </View>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
