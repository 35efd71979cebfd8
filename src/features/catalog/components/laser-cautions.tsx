import { Notice } from '../../../components/ui/notice.tsx';

/** The cautions shown wherever recipes are set or run. */
export function LaserCautions() {
  return (
    <Notice tone="caution" title="Before you burn">
      <ul className="list-disc space-y-0.5 pl-5">
        <li>A CO2 engraver is a Class 4 laser product (IEC 60825-1). Never leave it running unattended and keep fire suppression at hand.</li>
        <li>Run fume extraction. Wear eye protection rated for the laser’s wavelength whenever the enclosure is open.</li>
        <li>Never burn PVC or vinyl: they give off chlorine gas. Keep to the materials the machine maker allows.</li>
        <li>Glass can crack and chip. Wear gloves to handle it.</li>
        <li>These settings are starting points. Follow local codes, the machine maker’s manual and licensed practice.</li>
      </ul>
    </Notice>
  );
}
