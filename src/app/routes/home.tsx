import { Link } from 'react-router-dom';
import { Card } from '#src/components/ui/card.tsx';
import { buttonClasses } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';

const steps = [
  {
    title: 'The photo arrives',
    text: 'Buyers drop a phone photo on your storefront. Etchwell tells them at once whether it has enough pixels for the size they chose.',
  },
  {
    title: 'Your team prepares it',
    text: 'Cut the subject out, soften the edge, set the tone and sharpen hard — the burn softens detail, so the file must not.',
  },
  {
    title: 'Dots the laser can burn',
    text: 'Halftoning at your machine’s lines per inch, as a negative on glass, slate and granite, with each material’s recipe.',
  },
  { title: 'Proof, burn, ship', text: 'Buyers approve a proof before anything is burned, and hear from you when it ships.' },
];

export function HomePage() {
  return (
    <>
      <section className="mx-auto max-w-6xl px-6 pb-12 pt-16">
        <p className="mb-3 text-sm font-bold uppercase tracking-widest text-ember-600">For photo engraving studios</p>
        <h1 className="max-w-3xl text-4xl font-extrabold leading-tight text-graphite-950 sm:text-5xl">
          Etchwell turns your buyers&rsquo; photos into files your laser can burn.
        </h1>
        <p className="mt-5 max-w-2xl text-lg text-graphite-600">
          A storefront where buyers upload a photo, pick a blank and a size and see how it will look in glass, stone, wood or metal — and a
          workspace where your team checks the photo, prepares it, sends a proof, renders the engrave file and ships. One place for the work
          you now do by hand in two or three programs.
        </p>
        <div className="mt-8 flex flex-wrap gap-3">
          <Link to="/open-a-studio" className={buttonClasses('primary', 'lg')}>
            Open a studio
          </Link>
          <Link to="/sign-in" className={buttonClasses('secondary', 'lg')}>
            Sign in
          </Link>
        </div>
      </section>

      <section aria-labelledby="how-heading" className="mx-auto max-w-6xl px-6 pb-16">
        <h2 id="how-heading" className="mb-6 text-2xl font-bold">
          From the phone to the laser
        </h2>
        <ol className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          {steps.map((step, index) => (
            <li key={step.title}>
              <Card className="h-full">
                <p className="mb-2 text-sm font-extrabold text-ember-600">{String(index + 1).padStart(2, '0')}</p>
                <h3 className="mb-2 font-bold">{step.title}</h3>
                <p className="text-sm text-graphite-600">{step.text}</p>
              </Card>
            </li>
          ))}
        </ol>
      </section>

      <section className="mx-auto max-w-6xl px-6 pb-20">
        <Notice tone="caution" title="Laser safety">
          Engraving lasers are Class 4 laser products. Never leave a running machine unattended, keep fire suppression at hand, run fume
          extraction, wear eye protection rated for the wavelength, and never burn PVC or vinyl. Follow your machine maker&rsquo;s manual
          and local codes.
        </Notice>
      </section>
    </>
  );
}
