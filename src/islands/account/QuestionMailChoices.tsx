import EmailChoices from './EmailChoices';

/** The two e-mails about questions, each with its own switch (users.notifyQuestions / notifyAnswers). */
export default function QuestionMailChoices({
  notifyQuestions,
  notifyAnswers,
}: {
  notifyQuestions: boolean;
  notifyAnswers: boolean;
}) {
  return (
    <EmailChoices
      choices={[
        {
          field: 'notifyQuestions',
          label: 'E-mail me new questions on records I wrote and on subsystems I looked after in earlier seasons',
          onText: 'New questions that may concern you will come by e-mail.',
          offText: 'No e-mails about new questions; they still wait for you on the home page.',
          initial: notifyQuestions,
        },
        {
          field: 'notifyAnswers',
          label: 'E-mail me when someone answers one of my questions',
          onText: 'Answers to your questions will come by e-mail.',
          offText: 'No e-mails about answers; read them on the record.',
          initial: notifyAnswers,
        },
      ]}
    />
  );
}
