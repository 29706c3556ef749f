import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';

const GroupScreen = deferred('GroupScreen');

export default function Group() {
  const { groupId } = useLocalSearchParams<{ groupId?: string | string[] }>();
  return <GroupScreen groupId={firstParam(groupId)} />;
}
