import { Checkbox, makeStyles, tokens } from '@fluentui/react-components';
import { TEAM_ROLES, type TeamRole } from '@limbus/schema/team';

const useStyles = makeStyles({
  group: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalS,
    border: 'none',
    margin: 0,
    padding: 0,
  },
  legend: { padding: 0 },
  hidden: {
    position: 'absolute',
    width: '1px',
    height: '1px',
    overflow: 'hidden',
    clipPath: 'inset(50%)',
    whiteSpace: 'nowrap',
  },
});

/** One checkbox per team role, in the contract's order, inside a fieldset named by `legend`. */
export function RoleCheckboxes({
  legend,
  hideLegend = false,
  value,
  onChange,
  disabled = false,
  describedBy,
}: {
  legend: string;
  hideLegend?: boolean;
  value: readonly TeamRole[];
  onChange: (roles: TeamRole[]) => void;
  disabled?: boolean;
  describedBy?: string;
}) {
  const styles = useStyles();
  return (
    <fieldset className={styles.group} aria-describedby={describedBy}>
      <legend className={hideLegend ? styles.hidden : styles.legend}>{legend}</legend>
      {TEAM_ROLES.map((role) => (
        <Checkbox
          key={role}
          label={role}
          checked={value.includes(role)}
          disabled={disabled}
          onChange={(_, data) =>
            onChange(TEAM_ROLES.filter((r) => (r === role ? data.checked === true : value.includes(r))))
          }
        />
      ))}
    </fieldset>
  );
}
