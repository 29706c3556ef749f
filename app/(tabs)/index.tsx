import { LandingScreen } from '@/components/home/landing-screen';

export default function Landing() {
  return <LandingScreen />;
}
