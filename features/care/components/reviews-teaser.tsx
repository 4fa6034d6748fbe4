import { Link } from 'expo-router';
import { StyleSheet } from 'react-native';
import { Card } from '@/features/ui/components/card';
import { Text } from '@/features/ui/components/text';
import { space, type } from '@/features/ui/theme';
import { useReviewsQuery } from '../api/get-reviews';

/** On the physiotherapist's home: how many screens wait, and the way to the review list. */
export function ReviewsTeaser() {
  const query = useReviewsQuery();
  const waiting = query.data?.reviews.length ?? null;
  const urgent = query.data?.reviews.filter((r) => r.painReported || r.clearanceNeeded).length ?? 0;
  return (
    <Card testID="reviews-teaser">
      <Text variant="heading">
        {waiting === null ? 'Reviews' : waiting === 0 ? 'Nothing to review' : `${waiting} ${waiting === 1 ? 'screen' : 'screens'} to review`}
      </Text>
      {/* Two lines kept for this line whatever it says, so that the answer moves nothing below it. */}
      <Text style={styles.status}>
        {waiting === null
          ? 'Checking for pain reports and clearances…'
          : waiting === 0
            ? 'Screens submitted by the testers appear here.'
            : urgent > 0
              ? `${urgent} of them with pain reported or clearance needed.`
              : // Of the screens to review: an athlete already referred on is in the list, not in this count.
                'None of them with pain reported or clearance needed.'}
      </Text>
      <Link href="/reviews" style={styles.link} testID="open-reviews">
        <Text variant="label">Open the review list →</Text>
      </Link>
    </Card>
  );
}

const styles = StyleSheet.create({
  status: { minHeight: 2 * type.body.lineHeight },
  link: { minHeight: 48, paddingVertical: space.md },
});
