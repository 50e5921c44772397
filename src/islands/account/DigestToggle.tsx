import EmailChoices from './EmailChoices';

export default function DigestToggle({ initial }: { initial: boolean }) {
  return (
    <EmailChoices
      choices={[
        {
          field: 'digestOptIn',
          label: 'Send me the weekly digest by e-mail',
          onText: 'You will get the weekly digest.',
          offText: 'The weekly digest is off.',
          initial,
        },
      ]}
    />
  );
}
