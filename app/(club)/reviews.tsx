import { ReviewList } from '@/features/care/components/review-list';
import { Page } from '@/features/ui/components/page';

export default function ReviewsScreen() {
  return (
    <Page>
      <ReviewList />
    </Page>
  );
}
