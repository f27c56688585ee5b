import { Notice } from '@/components/ui/notice.tsx';

/** The usual cautions beside any check result, and the word that local codes come first. */
export function SafetyCautions({ unfused }: { unfused: boolean }) {
  return (
    <div className="grid gap-3">
      {unfused ? (
        <Notice tone="fault" title="A feed without a fuse is a fire risk">
          Fit a fuse near the source of every new feed before the harness is powered.
        </Notice>
      ) : null}
      <Notice tone="caution" title="Local codes and licensed practice prevail over these checks">
        <ul className="list-disc space-y-0.5 pl-4">
          <li>Disconnect the battery before working on the harness.</li>
          {unfused ? null : (
            <li>A feed without a fuse is a fire risk: fuse every new feed near its source.</li>
          )}
          <li>
            Take particular care with fuel-system and airbag circuits: a crash or inertia cut-off
            for the fuel pump; airbag circuits are not to be touched.
          </li>
          <li>
            Never probe an ECU pin with a test lamp or put 12 V on one; unplug the ECU before an
            insulation test.
          </li>
          <li>Emissions and anti-theft circuits may be regulated where the vehicle is used.</li>
          <li>
            Test before first power-up: continuity, shorts to ground and between neighbouring pins;
            power up first from a current-limited supply.
          </li>
        </ul>
      </Notice>
    </div>
  );
}
