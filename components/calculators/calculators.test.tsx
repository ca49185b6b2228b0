import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import {
  BatchPlanner,
  BoilingPointCalculator,
  BrineCalculator,
  CrispingCalculator,
  HeadspaceCalculator,
  PressureCalculator,
  ProcessingTimeCalculator,
  SaltCalculator,
  SugarCalculator,
  UnitConverter,
} from './index';

// user-event typing is slow on a loaded two-core machine: allow more than the default 5 s.
vi.setConfig({ testTimeout: 30_000 });

/** Replaces the text of a field the way a person does: select all, type. */
async function retype(user: ReturnType<typeof userEvent.setup>, field: HTMLElement, text: string) {
  await user.clear(field);
  if (text) await user.type(field, text);
}

describe('ProcessingTimeCalculator', () => {
  it('updates the minutes as the altitude is typed (USDA Guide 6, quick fresh-pack dill quarts: 15 / 20 / 25 min)', async () => {
    const user = userEvent.setup();
    render(<ProcessingTimeCalculator defaultProduct="fresh-pack-dill-pickles" />);
    await user.selectOptions(screen.getByLabelText('Jar size'), 'quart');
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('15 minutes');
    await retype(user, screen.getByLabelText('Altitude'), '4500');
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('20 minutes');
    await retype(user, screen.getByLabelText('Altitude'), '7000');
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('25 minutes');
    expect(screen.getByText(/low-temperature pasteurization/)).toBeInTheDocument();
  });

  it('shows the same messages as the route for a bad altitude, a jar outside the table, and above 10,000 ft', async () => {
    const user = userEvent.setup();
    render(<ProcessingTimeCalculator defaultProduct="dilly-beans" />);
    const altitude = screen.getByLabelText('Altitude');
    await retype(user, altitude, '-2000');
    expect(altitude).toHaveAttribute('aria-invalid', 'true');
    expect(altitude).toHaveAccessibleDescription(expect.stringContaining('The altitude in feet must be at least -1,500.'));
    expect(screen.queryByTestId('processing-minutes')).toBeNull();
    await retype(user, altitude, '12000');
    expect(screen.getByRole('status')).toHaveTextContent(/up to 10,000 ft.*local extension office/);
    await retype(user, altitude, '100');
    await user.selectOptions(screen.getByLabelText('Jar size'), 'quart');
    expect(screen.getByRole('status')).toHaveTextContent(/pint jars only/);
  });

  it('can be used with the keyboard alone', async () => {
    const user = userEvent.setup();
    render(<ProcessingTimeCalculator defaultProduct="pickle-relish" />);
    await user.tab();
    expect(screen.getByLabelText('Product')).toHaveFocus();
    await user.tab();
    expect(screen.getByLabelText('Jar size')).toHaveFocus();
    await user.tab();
    expect(screen.getByLabelText('Altitude')).toHaveFocus();
    await user.keyboard('{Control>}a{/Control}{Backspace}6500');
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('20 minutes');
    await user.tab();
    expect(screen.getByLabelText('Altitude in')).toHaveFocus();
    await user.tab();
    expect(screen.getByRole('link', { name: /Lesson: Processing/ })).toHaveFocus();
    expect(screen.getByRole('link', { name: /Lesson: Processing/ })).toHaveAttribute('href', '/learn/pickling-and-canning/processing');
  });
});

describe('ProcessingTimeCalculator: sterilised jars, metres and below sea level', () => {
  it('says dilly beans at 0–1,000 ft (5 min) need sterilised jars, with the Guide 1 source beside it', async () => {
    const user = userEvent.setup();
    render(<ProcessingTimeCalculator defaultProduct="dilly-beans" />);
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('5 minutes');
    // USDA Complete Guide to Home Canning, Guide 1, "Sterilization of empty jars": under 10 minutes, boil empty jars 10 min up to 1,000 ft.
    expect(screen.getByTestId('processing-sterilize')).toHaveTextContent(/must be sterilised before filling.*10 minutes at this altitude/);
    expect(screen.getByTestId('processing-sterilize')).toHaveTextContent(/Source: .*Sterilization of empty jars/);
    await retype(user, screen.getByLabelText('Altitude'), '2000');
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('10 minutes');
    expect(screen.queryByTestId('processing-sterilize')).toBeNull();
  });

  it('takes the altitude in metres (2,000 m = 6,562 ft: above 6,000 ft) and below sea level (lowest band)', async () => {
    const user = userEvent.setup();
    render(<ProcessingTimeCalculator defaultProduct="fresh-pack-dill-pickles" />);
    await user.selectOptions(screen.getByLabelText('Altitude in'), 'm');
    await retype(user, screen.getByLabelText('Altitude'), '2000');
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('20 minutes');
    expect(screen.getByLabelText('Altitude')).toHaveAccessibleDescription(expect.stringContaining('= 6,562 ft'));
    await retype(user, screen.getByLabelText('Altitude'), '-86');
    expect(screen.getByTestId('processing-minutes')).toHaveTextContent('10 minutes');
    expect(screen.getByLabelText('Altitude')).toHaveAccessibleDescription(expect.stringContaining('below sea level: the lowest band applies'));
    await retype(user, screen.getByLabelText('Altitude'), '-500');
    expect(screen.getByLabelText('Altitude')).toHaveAccessibleDescription(expect.stringContaining('The altitude in metres must be at least -457.'));
  });
});

describe('BrineCalculator', () => {
  it('updates acid and pH as volumes are typed (1 : 1 of 5 % vinegar: 2.5 %, pH 2.57, computed)', async () => {
    const user = userEvent.setup();
    render(<BrineCalculator />);
    expect(screen.getByTestId('brine-acid')).toHaveTextContent('2.5 g per 100 mL');
    expect(screen.getByTestId('brine-ph')).toHaveTextContent('2.57');
    expect(screen.getByTestId('brine-meaning')).toHaveTextContent(
      'at least as much acid as the weakest tested liquid Brinewright knows. That is arithmetic only',
    );
    // The equation's name is in the "how this is worked out" fold, not beside the number.
    expect(screen.getByTestId('brine-ph')).not.toHaveTextContent('weak-acid equation');
    expect(screen.getByText('How this is worked out').closest('details')).toHaveTextContent('weak-acid equation, acetic acid pKa 4.756');
    await retype(user, screen.getByLabelText('Water'), '0');
    expect(screen.getByTestId('brine-acid')).toHaveTextContent('5 g per 100 mL');
    expect(screen.getByTestId('brine-ph')).toHaveTextContent('2.42');
    await retype(user, screen.getByLabelText('Produce in the jars (optional)'), '1000');
    expect(screen.getByTestId('brine-equilibrated')).toHaveTextContent('no pH is given');
    // Only one pH on screen, and it is the liquid's before the produce, with the caution beside it.
    expect(screen.getAllByText(/pH of the liquid before the produce goes in/)).toHaveLength(1);
    expect(screen.getByTestId('brine-ph')).toHaveTextContent(/only the tested recipe, or a calibrated pH meter/);
  });

  it('warns below the weakest tested liquid when no product is chosen, naming it (quick fresh-pack dill, 2.14 %, USDA Guide 6)', async () => {
    const user = userEvent.setup();
    render(<BrineCalculator />);
    await retype(user, screen.getByLabelText('Vinegar'), '100');
    await retype(user, screen.getByLabelText('Water'), '1000');
    expect(screen.getByTestId('brine-warnings')).toHaveTextContent(
      '0.45% acetic acid, weaker than the weakest tested liquid Brinewright knows, that of quick fresh-pack dill pickles (2.14%)',
    );
    expect(screen.getByTestId('brine-tested')).toHaveTextContent('This liquid is weaker.');
    // What it means for the jar comes first, and stays a warning.
    expect(screen.getByTestId('brine-meaning')).toHaveTextContent('This liquid is weaker than any tested liquid Brinewright knows: do not use it');
  });

  it("compares with the chosen product's tested liquid (pickled hot peppers: 5 cups vinegar to 1 cup water, 4.17 %)", async () => {
    const user = userEvent.setup();
    render(<BrineCalculator />);
    expect(screen.queryByTestId('brine-warnings')).toBeNull();
    await user.selectOptions(screen.getByLabelText('Compare with'), 'pickled-hot-peppers');
    expect(screen.getByTestId('brine-tested')).toHaveTextContent('4.17 g per 100 mL, pickled hot peppers');
    expect(screen.getByTestId('brine-warnings')).toHaveTextContent(/2.5% acetic acid, weaker than the tested liquid of pickled hot peppers \(4.17%\)/);
    expect(screen.getByText(/Tested liquid: .*Pickled hot peppers/)).toBeInTheDocument();
    expect(screen.getByText(/Dissolved sugar is not counted in the volume/)).toBeInTheDocument();
  });

  it('keeps the old props working and takes a default product', () => {
    render(<BrineCalculator defaultProduct="pickled-beets" headingLevel={2} />);
    expect(screen.getByLabelText('Compare with')).toHaveValue('pickled-beets');
    expect(screen.getByRole('heading', { level: 2, name: 'Brine acidity' })).toBeInTheDocument();
  });

  it('warns about vinegar above 7 % (common practice) and names the cucumber-water source', async () => {
    const user = userEvent.setup();
    render(<BrineCalculator />);
    await retype(user, screen.getByLabelText('Vinegar acidity'), '10');
    expect(screen.getByTestId('brine-warnings')).toHaveTextContent(/above 7% acidity/);
    expect(screen.getByLabelText('Water in the produce (optional)')).toHaveAccessibleDescription(expect.stringContaining('USDA FoodData Central'));
  });

  it('warns below 5 % vinegar and shows the message for a bad value', async () => {
    const user = userEvent.setup();
    render(<BrineCalculator />);
    await retype(user, screen.getByLabelText('Vinegar acidity'), '4');
    expect(screen.getByText(/below 5% acidity/)).toBeInTheDocument();
    await retype(user, screen.getByLabelText('Vinegar'), 'lots');
    expect(screen.getByLabelText('Vinegar')).toHaveAccessibleDescription(expect.stringContaining('Enter the vinegar in mL as a number.'));
  });
});

describe('SaltCalculator', () => {
  it('weighs salt and gives brine strength; unsuitable salt says why', async () => {
    const user = userEvent.setup();
    render(<SaltCalculator />);
    // 3 tbsp = 9 tsp of canning salt at 4.6 (UW-Extension B2267, quoted secondhand) to 6 g/tsp (from memory): 41.4 to 54 g.
    expect(screen.getByTestId('salt-grams')).toHaveTextContent('about 41.4 to 54 g');
    expect(screen.getByTestId('salt-uncertainty')).toHaveTextContent(
      /By weight is exact; by spoon or cup is approximate.*University of Wisconsin-Extension B2267/,
    );
    await retype(user, screen.getByLabelText('Amount of salt'), '1/2');
    await user.selectOptions(screen.getByLabelText('Unit'), 'cup');
    expect(screen.getByTestId('salt-grams')).toHaveTextContent('about 110.4 to 144 g');
    expect(screen.getByTestId('salt-brine')).toHaveTextContent('Brine strength: 9.94 to 12.59% salt by weight');
    await user.selectOptions(screen.getByLabelText('Unit'), 'g');
    await retype(user, screen.getByLabelText('Amount of salt'), '50');
    expect(screen.getByTestId('salt-grams')).toHaveTextContent('50 g');
    expect(screen.queryByTestId('salt-uncertainty')).toBeNull();
    await user.selectOptions(screen.getByLabelText('Kind of salt'), 'table');
    expect(screen.getByText(/cloudy/)).toBeInTheDocument();
    await retype(user, screen.getByLabelText('Amount of salt'), '-2');
    expect(screen.getByLabelText('Amount of salt')).toHaveAccessibleDescription(expect.stringContaining('The amount of salt cannot be negative.'));
  });
});

describe('SugarCalculator', () => {
  it('weighs sugar and gives its share of the syrup (USDA FoodData Central SR Legacy, 1 cup granulated = 200 g; from memory)', async () => {
    const user = userEvent.setup();
    render(<SugarCalculator />);
    expect(screen.getByTestId('sugar-grams')).toHaveTextContent('about 400 g');
    expect(screen.getByTestId('sugar-uncertainty')).toHaveTextContent(/by spoon or cup is approximate.*FoodData Central/);
    // USDA Guide 6 bread-and-butter pickles: 4 1/2 cups sugar in 4 cups vinegar (from memory).
    await retype(user, screen.getByLabelText('Amount of sugar'), '4 1/2');
    await retype(user, screen.getByLabelText(/Vinegar and water/), '946');
    expect(screen.getByTestId('sugar-grams')).toHaveTextContent('900 g');
    expect(screen.getByText(/Sugar in the syrup: 48.8% by weight/)).toBeInTheDocument();
    await user.selectOptions(screen.getByLabelText('Kind of sugar'), 'brown-packed');
    expect(screen.getByTestId('sugar-grams')).toHaveTextContent('990 g');
    await retype(user, screen.getByLabelText('Amount of sugar'), 'lots');
    expect(screen.getByLabelText('Amount of sugar')).toHaveAccessibleDescription(expect.stringContaining('amount of sugar'));
  });
});

describe('HeadspaceCalculator', () => {
  it('gives the recommendation and a verdict as the measurement is typed', async () => {
    const user = userEvent.setup();
    render(<HeadspaceCalculator defaultProduct="pickled-beets" />);
    expect(screen.getByLabelText('Product')).toHaveValue('pickled-beets');
    expect(screen.getByTestId('headspace-recommended')).toHaveTextContent('Leave 1/2 inch (12.7 mm)');
    const measured = screen.getByLabelText('Measured headspace (optional)');
    await user.type(measured, '1/4');
    expect(screen.getByText('Too little headspace.')).toBeInTheDocument();
    await retype(user, measured, '0.5');
    expect(screen.getByText('Headspace is right.')).toBeInTheDocument();
    expect(screen.getByText(/Verdict tolerance: ±1\/8 inch, common practice/)).toBeInTheDocument();
    await retype(user, measured, 'about half');
    expect(measured).toHaveAccessibleDescription(expect.stringContaining('Enter the measured headspace in inches as a number.'));
  });
});

describe('PressureCalculator', () => {
  it('gives the dial-gauge pounds by altitude (USDA Guide 4 tables: 11 / 12 / 13 / 14)', async () => {
    const user = userEvent.setup();
    render(<PressureCalculator />);
    expect(screen.getByTestId('pressure-pounds')).toHaveTextContent('11 pounds (psi) on a dial gauge');
    await retype(user, screen.getByLabelText('Altitude'), '5000');
    expect(screen.getByTestId('pressure-pounds')).toHaveTextContent('13 pounds (psi)');
    await user.selectOptions(screen.getByLabelText('Gauge type'), 'weighted');
    expect(screen.getByTestId('pressure-pounds')).toHaveTextContent('15 pounds (psi)');
    await retype(user, screen.getByLabelText('Altitude'), '');
    expect(screen.getByLabelText('Altitude')).toHaveAccessibleDescription(expect.stringContaining('Enter the altitude in feet as a number.'));
  });
});

describe('BoilingPointCalculator', () => {
  it('gives the boiling point in °F and °C (about 203 °F at 5,000 ft; 212 °F at sea level within 0.1)', async () => {
    const user = userEvent.setup();
    render(<BoilingPointCalculator />);
    expect(screen.getByTestId('boiling-point')).toHaveTextContent('202.8 °F (94.9 °C)');
    // What the number means for the jar comes first; the pressure and the model sit in the fold.
    expect(screen.getByTestId('boiling-meaning')).toHaveTextContent('At this height water boils 9.2 °F cooler than at sea level');
    expect(screen.getByText('How this is worked out')).toBeInTheDocument();
    await retype(user, screen.getByLabelText('Altitude'), '0');
    expect(screen.getByTestId('boiling-meaning')).toHaveTextContent('about its sea-level temperature (212 °F)');
    expect(screen.getByTestId('boiling-point')).toHaveTextContent('212 °F (100 °C)');
    expect(screen.getByLabelText('Altitude')).toHaveAccessibleDescription(expect.stringContaining('= 0 m'));
  });
});

describe('CrispingCalculator', () => {
  it('doses calcium chloride per jar and in all, then gives the lime schedule with its cautions', async () => {
    const user = userEvent.setup();
    render(<CrispingCalculator />);
    expect(screen.getByTestId('crisping-dose')).toHaveTextContent('1/8 tsp per jar, 7/8 tsp in all');
    await retype(user, screen.getByLabelText('Number of jars'), '8');
    expect(screen.getByTestId('crisping-dose')).toHaveTextContent('1 tsp in all');
    await user.selectOptions(screen.getByLabelText('Crisping agent'), 'pickling-lime');
    // USDA Guide 6:19, bread-and-butter pickles, variation for firmer pickles: 1 cup lime and 1/2 cup salt per gallon.
    expect(screen.getByTestId('crisping-dose')).toHaveTextContent('1 cup of pickling lime and 1/2 cup of pickling salt in 1 gallon of water');
    expect(screen.getByTestId('crisping-recipe')).toHaveTextContent('For bread-and-butter pickles only');
    expect(screen.getByText(/three times/)).toBeInTheDocument();
    expect(screen.getByText(/Source: USDA Complete Guide to Home Canning.*variation for firmer pickles/)).toBeInTheDocument();
    await user.selectOptions(screen.getByLabelText('Jar size'), 'half-pint');
    expect(screen.getByRole('status')).toHaveTextContent(/pint and quart jars only/);
    await user.selectOptions(screen.getByLabelText('Jar size'), 'pint');
    await retype(user, screen.getByLabelText('Number of jars'), '2.5');
    expect(screen.getByLabelText('Number of jars')).toHaveAccessibleDescription(expect.stringContaining('The number of jars must be a whole number.'));
  });
});

describe('BatchPlanner', () => {
  it('scales the tested recipe to the jars typed', async () => {
    const user = userEvent.setup();
    render(<BatchPlanner defaultProduct="fresh-pack-dill-pickles" />);
    await retype(user, screen.getByLabelText('Number of jars'), '9');
    // USDA Guide 6 quick fresh-pack dill: 8 lb cucumbers, 14 cups liquid for about 9 pints (+10 %).
    expect(screen.getByTestId('batch-summary')).toHaveTextContent('8 lb (3.63 kg) of produce, 3,643 mL');
    expect(screen.getByText(/14 heads fresh dill/)).toBeInTheDocument();
    expect(screen.queryByTestId('batch-sterilize')).toBeNull();
    await user.selectOptions(screen.getByLabelText('Product'), 'dilly-beans');
    // Dilly beans: 5 min up to 1,000 ft, so sterilised jars there (USDA Complete Guide, Guide 1).
    expect(screen.getByTestId('batch-sterilize')).toHaveTextContent(/under 10 minutes: there, the jars must be sterilised/);
    await user.selectOptions(screen.getByLabelText('Jar size'), 'quart');
    expect(screen.getByRole('status')).toHaveTextContent(/pint jars only/);
  });
});

describe('UnitConverter', () => {
  it('converts as the value is typed and refuses a volume to a weight', async () => {
    const user = userEvent.setup();
    render(<UnitConverter />);
    expect(screen.getByTestId('convert-result')).toHaveTextContent('1 cup = 236.588237 mL');
    await retype(user, screen.getByLabelText('Value'), '2');
    await user.selectOptions(screen.getByLabelText('To'), 'tbsp');
    expect(screen.getByTestId('convert-result')).toHaveTextContent('2 cup = 32 tbsp');
    await user.selectOptions(screen.getByLabelText('To'), 'g');
    expect(screen.getByLabelText('To')).toHaveAccessibleDescription(expect.stringContaining('without a stated density'));
  });
});

describe('every calculator', () => {
  const all = [
    BatchPlanner,
    BoilingPointCalculator,
    BrineCalculator,
    CrispingCalculator,
    HeadspaceCalculator,
    PressureCalculator,
    ProcessingTimeCalculator,
    SaltCalculator,
    UnitConverter,
  ];

  it('ties every input to a label, has a heading, a live result, a caution and a lesson link', () => {
    for (const Calculator of all) {
      const { container, unmount } = render(<Calculator />);
      const section = container.querySelector('section')!;
      expect(within(section).getByRole('heading', { level: 3 })).toBeInTheDocument();
      for (const input of section.querySelectorAll('input, select')) {
        expect(input.id).not.toBe('');
        expect(section.querySelector(`label[for="${CSS.escape(input.id)}"]`), `${Calculator.name} ${input.outerHTML}`).not.toBeNull();
      }
      expect(within(section).getByRole('status')).toHaveAttribute('aria-live', 'polite');
      expect(
        within(section)
          .getByRole('link', { name: /^Lesson: / })
          .getAttribute('href'),
      ).toMatch(/^\/learn\/pickling-and-canning\//);
      expect(section.querySelector('svg[data-icon="warning"]')).not.toBeNull();
      unmount();
    }
  });

  it('takes a heading level for pages that list them under their own h1', () => {
    render(<BrineCalculator headingLevel={2} />);
    expect(screen.getByRole('heading', { level: 2, name: 'Brine acidity' })).toBeInTheDocument();
  });
});
