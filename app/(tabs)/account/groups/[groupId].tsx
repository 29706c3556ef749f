import { useLocalSearchParams } from 'expo-router';
import { GroupScreen } from '@/components/account/group-screen';
import { firstParam } from '@/components/account/form-errors';

export default function Group() {
  const { groupId } = useLocalSearchParams<{ groupId?: string | string[] }>();
  return <GroupScreen groupId={firstParam(groupId)} />;
}
