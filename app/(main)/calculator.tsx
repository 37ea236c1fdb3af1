import { deferredScreen } from '@/src/screens/deferredRoute';

const CalculatorScreen = deferredScreen((s) => s.CalculatorScreen);

export default function CalculatorRoute() {
  return <CalculatorScreen />;
}
